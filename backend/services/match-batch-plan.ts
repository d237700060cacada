import type { Readable } from 'node:stream';
import {
  batchPlanCsvHeader,
  batchPlanCsvRecord,
  type BatchPlanClassified,
  type BatchPlanLine,
  type PlanFrequencySource,
} from '../../shared/match/batch-results';
import { formatCelsius } from '../../shared/match/format';
import { quantityToSI, type Quantity } from '../../shared/units/quantity';
import type { SortPlanRow } from '../db/sort-plan-repository';
import { readingAt, streamBatchLines, type BatchReadings } from './match-batch';
import type { SortPlanAnswer } from './sort-plans';

/** What a batch needs of a saved plan: its windows per frequency and the range they span. */
export interface PlanWindows {
  frequencies: Array<{
    frequencyHz: number;
    windows: Array<{ product: string; lowSPerM: number; highSPerM: number }>;
  }>;
  recommendedFrequencyHz: number | null;
  /** The plan's temperature range, K; null if its inputs do not say (they always should). */
  temperatureK: { min: number; max: number } | null;
}

/** A saved plan's windows, read from its stored result and inputs. */
export function planWindowsOf(row: SortPlanRow): PlanWindows {
  const result = JSON.parse(row.resultJson) as SortPlanAnswer;
  const t = (row.inputs as { temperature?: { min: Quantity; max: Quantity } }).temperature;
  return {
    frequencies: result.frequencies.map((f) => ({
      frequencyHz: f.frequencyHz,
      windows: f.windows.map((w) => ({
        product: w.product,
        lowSPerM: w.lowSPerM,
        highSPerM: w.highSPerM,
      })),
    })),
    recommendedFrequencyHz: result.recommendedFrequencyHz,
    temperatureK: t
      ? { min: quantityToSI('temperature', t.min), max: quantityToSI('temperature', t.max) }
      : null,
  };
}

/**
 * A window's bounds are stored as decimal text of doubles and a reading is converted from its
 * unit: a reading on a bound by construction may land a rounding error outside it. Relative.
 */
const BOUND_SLACK = 1e-12;
/** Kelvin: a reading at the plan's own end temperature, converted from °F, is inside. */
const TEMPERATURE_SLACK_K = 1e-6;

/**
 * Classifies readings by a plan's windows. The frequency is the plan's nearest to the reading's
 * own in log terms (|ln f/fᵢ| least; the first listed on a tie), since windows move with the
 * skin depth, which goes as 1/√f; with no frequency in the reading, the plan's recommended one
 * (or its lowest when it recommends none). The windows already span the plan's temperature
 * range (each layer's coefficient applied over it), so a reading is compared as it is, and a
 * reading outside that range only gets a note: its piece may read outside its window.
 */
export function createPlanClassifier(plan: PlanWindows) {
  const frequencies = [...plan.frequencies];
  const fallback =
    frequencies.find((f) => f.frequencyHz === plan.recommendedFrequencyHz) ??
    frequencies.reduce((a, b) => (b.frequencyHz < a.frequencyHz ? b : a));
  const fallbackFrom: PlanFrequencySource =
    plan.recommendedFrequencyHz === null ? 'lowest' : 'recommended';
  const range = plan.temperatureK;
  return function classify(reading: {
    conductivitySPerM: number;
    temperatureK: number;
    frequencyHz: number | null;
  }): Omit<BatchPlanClassified, 'row' | 'id' | 'reading'> {
    let at = fallback;
    let frequencyFrom: PlanFrequencySource = fallbackFrom;
    if (reading.frequencyHz !== null) {
      frequencyFrom = 'reading';
      let best = Infinity;
      for (const f of frequencies) {
        const d = Math.abs(Math.log(reading.frequencyHz / f.frequencyHz));
        if (d < best) {
          best = d;
          at = f;
        }
      }
    }
    const s = reading.conductivitySPerM;
    const products = at.windows
      .filter((w) => s >= w.lowSPerM * (1 - BOUND_SLACK) && s <= w.highSPerM * (1 + BOUND_SLACK))
      .map((w) => w.product);
    const notes: string[] = [];
    if (
      range &&
      (reading.temperatureK < range.min - TEMPERATURE_SLACK_K ||
        reading.temperatureK > range.max + TEMPERATURE_SLACK_K)
    )
      notes.push(
        `temperature ${formatCelsius(reading.temperatureK)} is outside the plan's ${formatCelsius(range.min)} to ${formatCelsius(range.max)}, which its windows span`,
      );
    return {
      status: products.length === 0 ? 'none' : products.length === 1 ? 'product' : 'ambiguous',
      planFrequencyHz: at.frequencyHz,
      frequencyFrom,
      product: products.length === 1 ? products[0]! : null,
      products,
      notes,
    };
  };
}

/** The plan-classified answer line of reading i. */
export function batchPlanLine(
  batch: BatchReadings,
  i: number,
  classify: ReturnType<typeof createPlanClassifier>,
): BatchPlanLine {
  const { row, id, error, reading } = readingAt(batch, i);
  if (reading === null) return { row, id, status: 'error', error };
  const c = classify(reading);
  return {
    row,
    id,
    status: c.status,
    reading,
    planFrequencyHz: c.planFrequencyHz,
    frequencyFrom: c.frequencyFrom,
    product: c.product,
    products: c.products,
    notes: c.notes,
  };
}

/** The plan-classified answer as a byte stream, paced as the ranked one (streamBatchLines). */
export function batchPlanAnswer(
  batch: BatchReadings,
  plan: PlanWindows,
  format: 'csv' | 'ndjson',
): Readable {
  const classify = createPlanClassifier(plan);
  return streamBatchLines(batch.count, format === 'csv' ? batchPlanCsvHeader() : '', (i) => {
    const line = batchPlanLine(batch, i, classify);
    return format === 'csv' ? batchPlanCsvRecord(line) : `${JSON.stringify(line)}\n`;
  });
}
