import { valueOf, type AlloyRecord } from '../catalogue/alloy-record';
import { conductivityAtReference } from '../units/temperature-correction';
import { formatCelsius, formatGPerCm3, formatIacs, formatIacsRange } from './format';
import {
  baseMetalsFrom,
  estimateAlpha,
  mainElement,
  type BaseMetal,
  type TemperatureCorrection,
} from './temperature-estimate';

/** A reading in SI: conductivity in S/m, temperature in K, density in kg/m³. */
export interface MatchReading {
  conductivitySPerM: number;
  temperatureK?: number;
  densityKgPerM3?: number;
  /** Relative standard uncertainty of the conductivity reading, percent. */
  uncertaintyPercent: number;
}

/** A handbook range as the score used it (a nominal alone widened by ±2 %), SI. */
export interface ScoredRange {
  min: number;
  nominal: number;
  max: number;
}

export interface CandidateScore {
  score: number;
  /** The alloy's conductivity range at its reference temperature, S/m. */
  conductivityRangeSPerM: ScoredRange;
  /** The alloy's density range, kg/m³, when the table has one. */
  densityRangeKgPerM3: ScoredRange | null;
  /** The reading corrected to the alloy's reference temperature, S/m. */
  correctedConductivitySPerM: number;
  /** Whether and how the reading was corrected to the reference temperature. */
  correction: TemperatureCorrection;
  reasons: string[];
}

/**
 * Bounds assumed for an alloy whose coefficient is neither recorded nor estimable (no base metal
 * known): from 0 to 0.007 /K, a little above the largest of the pure metals in the table (iron,
 * 0.0065 /K, CRC). Such a comparison is also ranked at {@link UNCORRECTED_WEIGHT} of its score, so
 * that it never ranks as confidently as a corrected one.
 */
const UNKNOWN_ALPHA_BOUNDS = [0, 0.007] as const;
export const UNCORRECTED_WEIGHT = 0.5;

/** Relative uncertainty assumed for a density figure (weighing and measuring a piece), percent. */
export const DENSITY_UNCERTAINTY_PERCENT = 1;
/** Half-width used when a handbook gives a nominal only, as a fraction of it. */
const DEFAULT_HALF_RANGE = 0.02;

/**
 * How far a value lies outside [min, max] in standard uncertainties, folded into 0..1 by a
 * Gaussian (1 inside the range), times a gentle preference for values near the nominal, so that
 * two alloys whose ranges both contain the reading still rank by closeness.
 */
function closeness(
  value: number,
  nominal: number,
  min: number,
  max: number,
  u: number,
  spread: readonly [number, number] = [value, value],
): number {
  const outside = Math.max(0, min - spread[1], spread[0] - max);
  const width = Math.hypot((max - min) / 2, u);
  const nearNominal = Math.exp(-0.5 * ((value - nominal) / width) ** 2);
  return Math.exp(-0.5 * (outside / u) ** 2) * (0.75 + 0.25 * nearNominal);
}

/**
 * Scores how well a reading fits one alloy: the reading is corrected to the table's reference
 * temperature (linear law, IEC 60028) with the alloy's own coefficient where one is recorded, or
 * with one estimated from its base metal by Matthiessen's rule ({@link estimateAlpha}), whose
 * bounds widen the comparison; with neither, it is compared across the bounds any metal's α could
 * give and ranked at half its score. Then it is compared with the handbook range within the stated
 * uncertainty, and likewise for density when one is given. The method is ours; its scale (0..1)
 * ranks candidates and is no probability.
 *
 * @param bases the base metals for estimates ({@link baseMetalsFrom} of the whole table)
 */
export function scoreCandidate(
  reading: MatchReading,
  alloy: AlloyRecord,
  bases: Map<string, BaseMetal> = baseMetalsFrom([alloy]),
): CandidateScore | null {
  const conductivity = valueOf(alloy, 'conductivity');
  if (!conductivity) return null;
  const reasons: string[] = [];
  const referenceK = conductivity.referenceTemperatureK;
  const measuredK = reading.temperatureK ?? referenceK;
  const recorded = valueOf(alloy, 'resistivity_temperature_coefficient')?.nominal;
  const read = reading.conductivitySPerM;
  const dT = measuredK - referenceK;
  const at = formatCelsius(referenceK);
  const readAt = `${formatIacs(read)} %IACS read at ${formatCelsius(measuredK)}`;

  let sigma = read;
  /** The corrected reading's bounds where the coefficient is only known within bounds. */
  let spread: [number, number] = [read, read];
  let weight = 1;
  let correction: TemperatureCorrection;
  const bounded = (low: number, high: number): [number, number] => {
    const a = conductivityAtReference(read, measuredK, referenceK, low);
    const b = conductivityAtReference(read, measuredK, referenceK, high);
    return [Math.min(a, b), Math.max(a, b)];
  };
  if (Math.abs(dT) <= 0.05) {
    correction = {
      kind: 'none',
      rule: `read at the reference temperature (${at}): nothing to correct`,
    };
  } else if (recorded !== undefined) {
    sigma = conductivityAtReference(read, measuredK, referenceK, recorded);
    spread = [sigma, sigma];
    correction = { kind: 'recorded', alphaPerK: recorded };
    reasons.push(
      `${readAt} corrects to ${formatIacs(sigma)} %IACS at ${at} (α = ${recorded.toPrecision(3)} /K)`,
    );
  } else {
    const element = mainElement(alloy);
    const base = element ? bases.get(element) : undefined;
    if (base) {
      const estimate = estimateAlpha(1 / conductivity.nominal, base);
      sigma = conductivityAtReference(read, measuredK, referenceK, estimate.alphaPerK);
      spread = bounded(estimate.lowPerK, estimate.highPerK);
      const rule = `Matthiessen's rule from ${base.from}: α ≈ α_base·ρ_base/ρ_alloy = ${estimate.lowPerK.toPrecision(2)} /K, up to ${estimate.highPerK.toPrecision(2)} /K`;
      correction = { kind: 'estimated', alphaPerK: estimate.alphaPerK, rule };
      reasons.push(
        `no temperature coefficient on record: estimated by ${rule}; ${readAt} corrects to ${formatIacs(spread[0])}–${formatIacs(spread[1])} %IACS at ${at}`,
      );
    } else {
      spread = bounded(UNKNOWN_ALPHA_BOUNDS[0], UNKNOWN_ALPHA_BOUNDS[1]);
      sigma = (spread[0] + spread[1]) / 2;
      weight = UNCORRECTED_WEIGHT;
      correction = {
        kind: 'none',
        rule: `no coefficient on record and no base metal to estimate one: α taken anywhere from ${UNKNOWN_ALPHA_BOUNDS[0]} to ${UNKNOWN_ALPHA_BOUNDS[1]} /K and the score halved`,
      };
      reasons.push(
        `no temperature coefficient on record and none to estimate: the reading at ${formatCelsius(measuredK)} could be ${formatIacs(spread[0])}–${formatIacs(spread[1])} %IACS at ${at}; ranked at half its score`,
      );
    }
  }

  const nominal = conductivity.nominal;
  const min = conductivity.min ?? nominal * (1 - DEFAULT_HALF_RANGE);
  const max = conductivity.max ?? nominal * (1 + DEFAULT_HALF_RANGE);
  const u = (reading.uncertaintyPercent / 100) * sigma;
  let score = weight * closeness(sigma, nominal, min, max, u, spread);
  if (spread[1] >= min && spread[0] <= max) {
    reasons.push(`${formatIacs(sigma)} %IACS at ${at} lies inside ${formatIacsRange(min, max)}`);
  } else {
    const side = spread[1] < min ? 'below' : 'above';
    const gap = spread[1] < min ? min - spread[1] : spread[0] - max;
    reasons.push(
      `${formatIacs(sigma)} %IACS at ${at} lies ${formatIacs(gap)} %IACS ${side} ${formatIacsRange(min, max)}`,
    );
  }

  const density = valueOf(alloy, 'density');
  const dMin = density ? (density.min ?? density.nominal * (1 - DEFAULT_HALF_RANGE)) : 0;
  const dMax = density ? (density.max ?? density.nominal * (1 + DEFAULT_HALF_RANGE)) : 0;
  if (reading.densityKgPerM3 !== undefined && density) {
    const du = (DENSITY_UNCERTAINTY_PERCENT / 100) * reading.densityKgPerM3;
    const fit = closeness(reading.densityKgPerM3, density.nominal, dMin, dMax, du);
    score *= fit;
    const given = formatGPerCm3(reading.densityKgPerM3);
    reasons.push(
      fit > 0.5
        ? `density ${given} matches ${formatGPerCm3(density.nominal)}`
        : `density ${given} is off the handbook ${formatGPerCm3(density.nominal)}`,
    );
  }

  if (alloy.magnetic) {
    reasons.push(
      'magnetic: a ferromagnetic part reads through its permeability as well as its conductivity; check it with a magnet',
    );
  }
  return {
    score,
    correctedConductivitySPerM: sigma,
    conductivityRangeSPerM: { min, nominal, max },
    densityRangeKgPerM3: density ? { min: dMin, nominal: density.nominal, max: dMax } : null,
    correction,
    reasons,
  };
}
