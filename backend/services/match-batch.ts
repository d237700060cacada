import { Readable } from 'node:stream';
import { parse } from 'csv-parse';
import type { AlloyRecord } from '../../shared/catalogue/alloy-record';
import {
  BATCH_CANDIDATES,
  batchCsvHeader,
  batchCsvRecord,
  type BatchCandidate,
  type BatchLine,
} from '../../shared/match/batch-results';
import { formatCelsius } from '../../shared/match/format';
import { scorePrepared } from '../../shared/match/score';
import {
  canonicalUnit,
  conductivityUnits,
  densityUnits,
  frequencyUnits,
  resistivityUnits,
  temperatureUnits,
  unitAliases,
} from '../../shared/units/codes';
import { InvalidQuantityError, UnknownUnitError } from '../../shared/units/errors';
import { quantityToSI, type QuantityKind } from '../../shared/units/quantity';
import {
  LINEAR_LAW_RANGE_K,
  withinLinearLawRange,
} from '../../shared/units/temperature-correction';
import { ProblemError } from '../http/problem';
import { MIN_SCORE, prepareMatch } from './match';

/** Readings per batch: a sorting line's day is some tens of thousands. */
export const MAX_BATCH_ROWS = 100_000;
/** Bytes of CSV per batch (the file itself, not a multipart envelope around it). */
export const MAX_BATCH_BYTES = 20 * 1024 * 1024;
/** Characters of an id; longer is refused for that row. */
export const MAX_ID_LENGTH = 100;
/** Default relative standard uncertainty of a reading, percent (as POST /match). */
const DEFAULT_UNCERTAINTY_PERCENT = 2;

type Measured = 'electrical' | 'temperature' | 'density' | 'frequency';
const UNITS: Record<Measured, readonly string[]> = {
  electrical: [...conductivityUnits, ...resistivityUnits],
  temperature: temperatureUnits,
  density: densityUnits,
  frequency: frequencyUnits,
};
const KIND: Record<Measured, QuantityKind> = {
  electrical: 'conductivity',
  temperature: 'temperature',
  density: 'density',
  frequency: 'frequency',
};
/** Largest value per quantity, in the unit given (the limits of POST /match's quantities). */
const MAX_VALUE: Record<Measured, number> = {
  electrical: 1e12,
  temperature: 2000,
  density: 1e6,
  frequency: 1e9,
};

/** Every unit a column may name for a quantity: canonical codes and their Unicode spellings. */
function unitsFor(measured: Measured): string[] {
  const codes = UNITS[measured];
  return [
    ...codes,
    ...Object.entries(unitAliases)
      .filter(([, c]) => codes.includes(c))
      .map(([a]) => a),
  ];
}

/** The columns a batch file may have; `conductivity` or `resistivity` and `temperature` it must. */
export const BATCH_COLUMNS = {
  id: 'optional: your label for the reading, up to 100 characters, echoed back',
  conductivity:
    'the reading, with its unit in the header, e.g. "conductivity (%IACS)", or in a conductivity_unit column (S/m, MS/m, %IACS)',
  resistivity:
    'instead of conductivity: the reading as a resistivity, e.g. "resistivity (uohm_cm)" (ohm_m, uohm_cm, nohm_m)',
  temperature: 'the temperature of the piece, e.g. "temperature (C)" (C, K, F)',
  density: 'optional, e.g. "density (g/cm3)" (kg/m3, g/cm3, lb/in3)',
  frequency:
    'optional: the instrument frequency, e.g. "frequency (kHz)" (Hz, kHz, MHz); echoed back, not used to rank the table',
  uncertainty_percent: `optional: relative standard uncertainty of the reading, 0.1 to 50 (default ${DEFAULT_UNCERTAINTY_PERCENT})`,
} as const;

/** A quantity column: where its value is, and its unit (in the header, or a column per row). */
interface QuantityColumn {
  index: number;
  measured: Measured;
  /** The header's name for it: conductivity, resistivity, temperature, density, frequency. */
  name: string;
  unit: string | null;
  unitIndex: number | null;
  /**
   * Values already converted, by unit and value: convert-units (temperature, density) costs some
   * 20 µs a call, and a line's log repeats the same few figures many times.
   */
  memo: Map<string, number>;
}

/** Conversions remembered per column of a batch. */
const MEMO_SIZE = 10_000;

export interface BatchLayout {
  columns: number;
  id: number | null;
  electrical: QuantityColumn;
  temperature: QuantityColumn;
  density: QuantityColumn | null;
  frequency: QuantityColumn | null;
  uncertainty: number | null;
}

const badHeader = (detail: string) =>
  new ProblemError(
    400,
    'Bad request',
    `${detail} Expected columns: ${Object.keys(BATCH_COLUMNS).join(', ')} (GET /api/v1/match/batch/template shows them).`,
    [{ path: '/body/header', message: detail }],
  );

const EXAMPLE_UNIT: Record<string, string> = {
  conductivity: '%IACS',
  resistivity: 'uohm_cm',
  temperature: 'C',
  density: 'g/cm3',
  frequency: 'kHz',
};

const QUANTITY_NAMES: Record<string, Measured> = {
  conductivity: 'electrical',
  resistivity: 'electrical',
  temperature: 'temperature',
  density: 'density',
  frequency: 'frequency',
};

/**
 * Reads the header line. A name is matched without regard to case or spaces; a unit in brackets
 * ("conductivity (%IACS)", "density [g/cm3]") is matched exactly (MS/m is not mS/m). Unknown,
 * repeated or missing columns, and a quantity with no unit or the wrong kind of unit, are refused
 * with the columns expected.
 */
export function parseBatchHeader(cells: string[]): BatchLayout {
  const seen = new Map<string, { index: number; unit: string | null }>();
  const unknown: string[] = [];
  cells.forEach((raw, index) => {
    const m = /^([^([]*?)\s*(?:[([]\s*([^)\]]*?)\s*[)\]])?$/.exec(raw.trim());
    const name = (m?.[1] ?? raw).trim().toLowerCase().replace(/\s+/g, '_');
    const unit = m?.[2] || null;
    const known =
      name in BATCH_COLUMNS ||
      (name.endsWith('_unit') && name.slice(0, -5) in QUANTITY_NAMES && !unit);
    if (!known || (unit && !(name in QUANTITY_NAMES))) {
      unknown.push(raw.trim() === '' ? `(an empty header in column ${index + 1})` : `"${raw}"`);
      return;
    }
    if (seen.has(name)) throw badHeader(`The column ${name} appears twice.`);
    seen.set(name, { index, unit });
  });
  if (unknown.length === cells.length)
    throw badHeader(
      'The first line must name the columns; none of it does (is the header missing?).',
    );
  if (unknown.length) throw badHeader(`Unknown column(s): ${unknown.join(', ')}.`);
  if (seen.has('conductivity') && seen.has('resistivity'))
    throw badHeader('Give conductivity or resistivity, not both.');
  const electricalName = seen.has('resistivity') ? 'resistivity' : 'conductivity';
  const missing = [
    ...(seen.has(electricalName) ? [] : ['conductivity (or resistivity)']),
    ...(seen.has('temperature') ? [] : ['temperature']),
  ];
  if (missing.length) throw badHeader(`Missing column(s): ${missing.join(', ')}.`);

  const quantity = (name: string): QuantityColumn | null => {
    const column = seen.get(name);
    const unitColumn = seen.get(`${name}_unit`);
    if (!column) {
      if (unitColumn) throw badHeader(`${name}_unit is given without a ${name} column.`);
      return null;
    }
    const measured = QUANTITY_NAMES[name]!;
    if (column.unit && unitColumn)
      throw badHeader(`${name} has a unit in its header and a ${name}_unit column: keep one.`);
    if (!column.unit && !unitColumn)
      throw badHeader(
        `${name} needs a unit: write it in the header, e.g. "${name} (${EXAMPLE_UNIT[name]})", or add a ${name}_unit column.`,
      );
    if (column.unit) {
      const problem = unitProblem(name, measured, column.unit);
      if (problem) throw badHeader(`The header "${cells[column.index]}": ${problem}`);
    }
    return {
      index: column.index,
      measured,
      name,
      unit: column.unit ? canonicalUnit(column.unit) : null,
      unitIndex: unitColumn?.index ?? null,
      memo: new Map<string, number>(),
    };
  };
  return {
    columns: cells.length,
    id: seen.get('id')?.index ?? null,
    electrical: quantity(electricalName)!,
    temperature: quantity('temperature')!,
    density: quantity('density'),
    frequency: quantity('frequency'),
    uncertainty: seen.get('uncertainty_percent')?.index ?? null,
  };
}

/** Why a unit does not fit a column, or null when it does. */
function unitProblem(name: string, measured: Measured, unit: string): string | null {
  if (!unitsFor(measured).includes(unit))
    return `'${unit}' is not a unit of ${name} (one of ${UNITS[measured].join(', ')})`;
  if (measured === 'electrical') {
    const resistive = (resistivityUnits as readonly string[]).includes(canonicalUnit(unit));
    if (resistive !== (name === 'resistivity'))
      return `'${unit}' is a ${resistive ? 'resistivity' : 'conductivity'} unit, under ${name}`;
  }
  return null;
}

/** A decimal number as people write it (a decimal comma too), or undefined. */
const NUMBER = /^[+-]?(\d+([.,]\d*)?|[.,]\d+)([eE][+-]?\d+)?$/;
function numberOf(text: string): number | undefined {
  return NUMBER.test(text) ? Number(text.replace(',', '.')) : undefined;
}

class RowError extends Error {}

/** The SI value of one quantity cell of a row, or a RowError naming the column. */
function quantityOf(cells: string[], column: QuantityColumn): number {
  const text = cells[column.index] ?? '';
  if (text === '') throw new RowError(`${column.name} is empty`);
  const value = numberOf(text);
  if (value === undefined || !Number.isFinite(value))
    throw new RowError(`${column.name} '${text.slice(0, 40)}' is not a number`);
  let unit = column.unit;
  if (column.unitIndex !== null) {
    const given = cells[column.unitIndex] ?? '';
    if (given === '') throw new RowError(`${column.name}_unit is empty`);
    const problem = unitProblem(column.name, column.measured, given);
    if (problem) throw new RowError(`${column.name}_unit: ${problem}`);
    unit = canonicalUnit(given);
  }
  if (Math.abs(value) > MAX_VALUE[column.measured])
    throw new RowError(`${column.name} ${text} is larger than ${MAX_VALUE[column.measured]}`);
  if (column.measured !== 'temperature' && value <= 0)
    throw new RowError(`${column.name} must be greater than zero`);
  let si: number;
  const key = `${unit}:${value}`;
  const known = column.memo.get(key);
  try {
    si = known ?? quantityToSI(KIND[column.measured], { value, unit: unit! });
  } catch (error) {
    if (error instanceof InvalidQuantityError || error instanceof UnknownUnitError)
      throw new RowError(`${column.name}: ${error.message}`);
    throw error;
  }
  if (!Number.isFinite(si) || si === 0)
    throw new RowError(`${column.name} ${text} ${unit} is too extreme to express in SI units`);
  if (known === undefined && column.memo.size < MEMO_SIZE) column.memo.set(key, si);
  return si;
}

/** An optional column's SI value, or null where the file has no such column or an empty cell. */
function optionalQuantityOf(cells: string[], column: QuantityColumn | null): number | null {
  return column && (cells[column.index] ?? '') !== '' ? quantityOf(cells, column) : null;
}

/** What a row of the file gives: a reading, or why it gives none. */
export type ParsedRow =
  | {
      id: string | null;
      conductivitySPerM: number;
      temperatureK: number;
      densityKgPerM3: number | null;
      frequencyHz: number | null;
      uncertaintyPercent: number;
    }
  | { id: string | null; error: string };

/** Checks one record against the header's layout. */
export function parseBatchRow(cells: string[], layout: BatchLayout): ParsedRow {
  const rawId = layout.id === null ? '' : (cells[layout.id] ?? '');
  const id = rawId === '' ? null : rawId.slice(0, MAX_ID_LENGTH);
  try {
    if (cells.length !== layout.columns)
      throw new RowError(`has ${cells.length} cell(s); the header names ${layout.columns}`);
    if (rawId.length > MAX_ID_LENGTH)
      throw new RowError(`id is longer than ${MAX_ID_LENGTH} characters`);
    const conductivitySPerM = quantityOf(cells, layout.electrical);
    const temperatureK = quantityOf(cells, layout.temperature);
    if (!withinLinearLawRange(temperatureK)) {
      const { min, max } = LINEAR_LAW_RANGE_K;
      throw new RowError(
        `temperature ${formatCelsius(temperatureK)} is outside ${formatCelsius(min)} to ${formatCelsius(max)}, where a linear temperature coefficient corrects conductivity`,
      );
    }
    const densityKgPerM3 = optionalQuantityOf(cells, layout.density);
    const frequencyHz = optionalQuantityOf(cells, layout.frequency);
    let uncertaintyPercent = DEFAULT_UNCERTAINTY_PERCENT;
    const u = layout.uncertainty === null ? '' : (cells[layout.uncertainty] ?? '');
    if (u !== '') {
      const value = numberOf(u);
      if (value === undefined || !(value >= 0.1 && value <= 50))
        throw new RowError(
          `uncertainty_percent '${u.slice(0, 40)}' is not a number from 0.1 to 50`,
        );
      uncertaintyPercent = value;
    }
    return { id, conductivitySPerM, temperatureK, densityKgPerM3, frequencyHz, uncertaintyPercent };
  } catch (error) {
    if (error instanceof RowError) return { id, error: error.message };
    throw error;
  }
}

/**
 * The readings of a file, held column by column as numbers (some fifty bytes a reading besides
 * its id), so that 100,000 of them take a few megabytes: the file's text is never held whole.
 */
export class BatchReadings {
  readonly rows: number[] = [];
  readonly ids: Array<string | null> = [];
  readonly conductivity: number[] = [];
  readonly temperature: number[] = [];
  /** NaN where the file gives none. */
  readonly density: number[] = [];
  readonly frequency: number[] = [];
  readonly uncertainty: number[] = [];
  /** Why a row gives no reading, by its index here. */
  readonly errors = new Map<number, string>();

  get count(): number {
    return this.rows.length;
  }

  add(row: number, parsed: ParsedRow): void {
    const i = this.rows.length;
    this.rows.push(row);
    this.ids.push(parsed.id);
    if ('error' in parsed) {
      this.errors.set(i, parsed.error);
      this.conductivity.push(NaN);
      this.temperature.push(NaN);
      this.density.push(NaN);
      this.frequency.push(NaN);
      this.uncertainty.push(NaN);
      return;
    }
    this.conductivity.push(parsed.conductivitySPerM);
    this.temperature.push(parsed.temperatureK);
    this.density.push(parsed.densityKgPerM3 ?? NaN);
    this.frequency.push(parsed.frequencyHz ?? NaN);
    this.uncertainty.push(parsed.uncertaintyPercent);
  }
}

/**
 * Reads a CSV of readings from a stream as it arrives: refuses binary (a NUL byte, 415) and text
 * that is not UTF-8 at the first bad chunk, parses record by record through csv-parse, checks the
 * header at once and each row as it comes, and stops at MAX_BATCH_BYTES or MAX_BATCH_ROWS (413).
 * A row with a bad value becomes an error entry and reading goes on; a file whose CSV structure
 * breaks (an unclosed quote) is refused whole (400). On failure the rest of the stream is drained,
 * not destroyed, so that the problem response still reaches the client.
 */
export function readBatch(source: Readable): Promise<BatchReadings> {
  return new Promise((resolve, reject) => {
    const decoder = new TextDecoder('utf-8', { fatal: true });
    const parser = parse({
      bom: true,
      info: true,
      relax_column_count: true,
      skip_empty_lines: true,
      trim: true,
      max_record_size: 10_000,
    });
    const batch = new BatchReadings();
    let layout: BatchLayout | null = null;
    let bytes = 0;
    let settled = false;
    const fail = (problem: Error) => {
      if (settled) return;
      settled = true;
      source.off('data', onData);
      source.resume();
      parser.destroy();
      reject(problem);
    };
    parser.on('readable', () => {
      let item: { record: string[]; info: { lines: number } } | null;
      while (!settled && (item = parser.read()) !== null) {
        if (!layout) {
          try {
            layout = parseBatchHeader(item.record);
          } catch (error) {
            return fail(error as Error);
          }
          continue;
        }
        if (batch.count >= MAX_BATCH_ROWS)
          return fail(
            new ProblemError(
              413,
              'Request body too large',
              `At most ${MAX_BATCH_ROWS.toLocaleString('en-US')} readings per batch; this file has more. Send it in parts.`,
            ),
          );
        batch.add(item.info.lines, parseBatchRow(item.record, layout));
      }
    });
    parser.on('error', (error) =>
      fail(
        new ProblemError(400, 'Bad request', `The CSV file does not parse: ${error.message}`, [
          { path: '/body', message: error.message },
        ]),
      ),
    );
    parser.on('end', () => {
      if (settled) return;
      if (!layout)
        return fail(
          new ProblemError(400, 'Bad request', 'The file is empty: send a header and readings.'),
        );
      if (batch.count === 0)
        return fail(new ProblemError(400, 'Bad request', 'The file has a header but no readings.'));
      settled = true;
      resolve(batch);
    });
    const onData = (chunk: Buffer) => {
      if (settled) return;
      bytes += chunk.length;
      if (bytes > MAX_BATCH_BYTES)
        return fail(
          new ProblemError(
            413,
            'Request body too large',
            `A batch file may be at most ${MAX_BATCH_BYTES / 1024 / 1024} MiB. Send it in parts.`,
          ),
        );
      if (chunk.includes(0))
        return fail(
          new ProblemError(
            415,
            'Unsupported media type',
            'The file is binary (or UTF-16), not CSV text: save it as CSV in UTF-8.',
          ),
        );
      let text: string;
      try {
        text = decoder.decode(chunk, { stream: true });
      } catch {
        return fail(
          new ProblemError(
            415,
            'Unsupported media type',
            'The file is not UTF-8 text: save it as CSV in UTF-8.',
          ),
        );
      }
      parser.write(text);
    };
    source.on('data', onData);
    source.on('end', () => {
      if (settled) return;
      try {
        parser.write(decoder.decode());
      } catch {
        return fail(
          new ProblemError(
            415,
            'Unsupported media type',
            'The file is not UTF-8 text: it ends inside a character.',
          ),
        );
      }
      parser.end();
    });
    source.on('error', () =>
      fail(new ProblemError(400, 'Bad request', 'The upload was cut short.')),
    );
  });
}

/**
 * Ranks readings against the table as POST /match does (the same scores, the same order, the
 * same floor), keeping the best three: the table is prepared once per batch, and each reading
 * costs arithmetic only (scorePrepared), no reasons in words.
 */
export function createBatchMatcher(alloys: AlloyRecord[]) {
  const prepared = prepareMatch(alloys);
  const better = (a: BatchCandidate, b: BatchCandidate) =>
    b.score - a.score || a.name.localeCompare(b.name);
  return function rank(reading: {
    conductivitySPerM: number;
    temperatureK: number;
    densityKgPerM3?: number;
    uncertaintyPercent: number;
  }): BatchCandidate[] {
    const top: BatchCandidate[] = [];
    for (const s of prepared) {
      let score: number;
      try {
        score = scorePrepared(reading, s).score;
      } catch (error) {
        // As matchReading: this alloy's own coefficient turns the linear law negative here.
        if (error instanceof InvalidQuantityError) continue;
        throw error;
      }
      if (score < MIN_SCORE) continue;
      const c = { slug: s.alloy.slug, name: s.alloy.name, uns: s.alloy.uns, score };
      c.score = Number(score.toFixed(4));
      if (top.length === BATCH_CANDIDATES && better(c, top[BATCH_CANDIDATES - 1]!) >= 0) continue;
      let at = top.length;
      while (at > 0 && better(c, top[at - 1]!) < 0) at--;
      top.splice(at, 0, c);
      if (top.length > BATCH_CANDIDATES) top.pop();
    }
    return top;
  };
}

/** Rows matched between two turns of the event loop: small enough to leave room for others. */
const ROWS_PER_SLICE = 500;

/**
 * Reading i as both answers report it: its row, its id, and either its error or the reading (a
 * missing density or frequency, stored as NaN in the columns, becomes null).
 */
export function readingAt(batch: BatchReadings, i: number) {
  const row = batch.rows[i]!;
  const id = batch.ids[i]!;
  const error = batch.errors.get(i);
  if (error !== undefined) return { row, id, error, reading: null } as const;
  const density = batch.density[i]!;
  const frequency = batch.frequency[i]!;
  const reading = {
    conductivitySPerM: batch.conductivity[i]!,
    temperatureK: batch.temperature[i]!,
    densityKgPerM3: Number.isNaN(density) ? null : density,
    frequencyHz: Number.isNaN(frequency) ? null : frequency,
    uncertaintyPercent: batch.uncertainty[i]!,
  };
  return { row, id, error: undefined, reading } as const;
}

/** The answer line of reading i. */
export function batchLine(
  batch: BatchReadings,
  i: number,
  rank: ReturnType<typeof createBatchMatcher>,
): BatchLine {
  const { row, id, error, reading } = readingAt(batch, i);
  if (reading === null) return { row, id, status: 'error', error };
  const candidates = rank({
    conductivitySPerM: reading.conductivitySPerM,
    temperatureK: reading.temperatureK,
    densityKgPerM3: reading.densityKgPerM3 ?? undefined,
    uncertaintyPercent: reading.uncertaintyPercent,
  });
  return { row, id, status: candidates.length ? 'matched' : 'none', reading, candidates };
}

/**
 * The answer as a byte stream, computed as the client reads it: a slice of rows at a time, each
 * after a turn of the event loop, and only when the response has room (stream backpressure), so
 * neither the answer nor its computation piles up in memory.
 */
export function batchAnswer(
  batch: BatchReadings,
  alloys: AlloyRecord[],
  format: 'csv' | 'ndjson',
): Readable {
  const rank = createBatchMatcher(alloys);
  return streamBatchLines(batch.count, format === 'csv' ? batchCsvHeader() : '', (i) => {
    const line = batchLine(batch, i, rank);
    return format === 'csv' ? batchCsvRecord(line) : `${JSON.stringify(line)}\n`;
  });
}

/**
 * The lines of an answer as a byte stream: `header`, then `record(i)` for each reading, a slice
 * of ROWS_PER_SLICE at a time after a turn of the event loop, and only when the reader has room.
 */
export function streamBatchLines(
  count: number,
  header: string,
  record: (i: number) => string,
): Readable {
  let next = 0;
  let headerSent = header === '';
  let timer: NodeJS.Immediate | undefined;
  return new Readable({
    read() {
      timer = setImmediate(() => {
        let text = '';
        try {
          if (!headerSent) {
            text += header;
            headerSent = true;
          }
          const end = Math.min(next + ROWS_PER_SLICE, count);
          for (; next < end; next++) text += record(next);
        } catch (error) {
          // Outside any request handler here: a fault ends this answer, never the process.
          return this.destroy(error as Error);
        }
        if (text) this.push(text);
        if (next >= count) this.push(null);
      });
    },
    destroy(error, callback) {
      if (timer) clearImmediate(timer);
      callback(error);
    },
  });
}
