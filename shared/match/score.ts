import { valueOf, type AlloyRecord } from '../catalogue/alloy-record';
import { conductivityAtReference } from '../units/temperature-correction';
import { formatCelsius, formatGPerCm3, formatIacs, formatIacsRange } from './format';
import {
  baseMetalsFrom,
  estimateAlpha,
  mainElement,
  type AlphaEstimate,
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
  low = value,
  high = value,
): number {
  const outside = Math.max(0, min - high, low - max);
  // Math.sqrt rather than Math.hypot: the same figure here (no overflow near 1e8 S/m), several
  // times faster, and Match scores every alloy of the table for every reading.
  const half = (max - min) / 2;
  const width = Math.sqrt(half * half + u * u);
  const nearNominal = Math.exp(-0.5 * ((value - nominal) / width) ** 2);
  return Math.exp(-0.5 * (outside / u) ** 2) * (0.75 + 0.25 * nearNominal);
}

/** What scoring a reading against one alloy needs from the table, worked out once per alloy. */
export interface AlloyScoring {
  alloy: AlloyRecord;
  /** The temperature the alloy's conductivity refers to, K. */
  referenceK: number;
  /** The alloy's conductivity range at referenceK (a nominal alone widened by ±2 %), S/m. */
  conductivity: ScoredRange;
  /** How a reading at another temperature is brought to referenceK. */
  alpha:
    | { kind: 'recorded'; alphaPerK: number }
    | { kind: 'estimated'; estimate: AlphaEstimate }
    | { kind: 'unknown' };
  density: ScoredRange | null;
}

/**
 * The per-alloy part of {@link scoreCandidate}: its ranges and how its coefficient is known. A
 * batch of readings prepares the table once and scores every reading with {@link scorePrepared};
 * null for an alloy with no conductivity on record.
 */
export function alloyScoring(
  alloy: AlloyRecord,
  bases: Map<string, BaseMetal> = baseMetalsFrom([alloy]),
): AlloyScoring | null {
  const conductivity = valueOf(alloy, 'conductivity');
  if (!conductivity) return null;
  const recorded = valueOf(alloy, 'resistivity_temperature_coefficient')?.nominal;
  let alpha: AlloyScoring['alpha'];
  if (recorded !== undefined) alpha = { kind: 'recorded', alphaPerK: recorded };
  else {
    const element = mainElement(alloy);
    const base = element ? bases.get(element) : undefined;
    alpha = base
      ? { kind: 'estimated', estimate: estimateAlpha(1 / conductivity.nominal, base) }
      : { kind: 'unknown' };
  }
  const nominal = conductivity.nominal;
  const density = valueOf(alloy, 'density');
  return {
    alloy,
    referenceK: conductivity.referenceTemperatureK,
    conductivity: {
      min: conductivity.min ?? nominal * (1 - DEFAULT_HALF_RANGE),
      nominal,
      max: conductivity.max ?? nominal * (1 + DEFAULT_HALF_RANGE),
    },
    alpha,
    density: density
      ? {
          min: density.min ?? density.nominal * (1 - DEFAULT_HALF_RANGE),
          nominal: density.nominal,
          max: density.max ?? density.nominal * (1 + DEFAULT_HALF_RANGE),
        }
      : null,
  };
}

/** The figures of one comparison, before any words are put to them. */
export interface PreparedScore {
  score: number;
  /** The reading at the reference temperature (the middle of `spread` when α is unknown), S/m. */
  sigma: number;
  /** The corrected reading's bounds where the coefficient is only known within bounds, S/m. */
  spread: [number, number];
  /** Whether the reading was corrected at all (not when read within 0.05 K of the reference). */
  corrected: boolean;
  /** The density fit (1 inside the range) when a density was given and the table has one. */
  densityFit: number | null;
}

/**
 * The reading at the reference temperature for a coefficient anywhere from `low` to `high`, S/m.
 * A function of its own rather than a closure: the batch path calls scorePrepared millions of
 * times, and a closure made per call costs more than the arithmetic.
 */
function bounded(
  read: number,
  measuredK: number,
  referenceK: number,
  low: number,
  high: number,
): [number, number] {
  const a = conductivityAtReference(read, measuredK, referenceK, low);
  const b = conductivityAtReference(read, measuredK, referenceK, high);
  return [Math.min(a, b), Math.max(a, b)];
}

/**
 * The score of {@link scoreCandidate} without its reasons: arithmetic only, so that a batch of
 * readings costs a fraction of a microsecond per alloy. Throws InvalidQuantityError where the
 * alloy's coefficient turns the linear law negative at the reading's temperature.
 */
export function scorePrepared(reading: MatchReading, s: AlloyScoring): PreparedScore {
  const read = reading.conductivitySPerM;
  const referenceK = s.referenceK;
  const measuredK = reading.temperatureK ?? referenceK;
  let sigma = read;
  let spread: [number, number] = [read, read];
  let weight = 1;
  const corrected = Math.abs(measuredK - referenceK) > 0.05;
  if (corrected) {
    if (s.alpha.kind === 'recorded') {
      sigma = conductivityAtReference(read, measuredK, referenceK, s.alpha.alphaPerK);
      spread = [sigma, sigma];
    } else if (s.alpha.kind === 'estimated') {
      const e = s.alpha.estimate;
      sigma = conductivityAtReference(read, measuredK, referenceK, e.alphaPerK);
      spread = bounded(read, measuredK, referenceK, e.lowPerK, e.highPerK);
    } else {
      spread = bounded(read, measuredK, referenceK, ...UNKNOWN_ALPHA_BOUNDS);
      sigma = (spread[0] + spread[1]) / 2;
      weight = UNCORRECTED_WEIGHT;
    }
  }
  const { nominal, min, max } = s.conductivity;
  const u = (reading.uncertaintyPercent / 100) * sigma;
  let score = weight * closeness(sigma, nominal, min, max, u, spread[0], spread[1]);
  let densityFit: number | null = null;
  if (reading.densityKgPerM3 !== undefined && s.density) {
    const du = (DENSITY_UNCERTAINTY_PERCENT / 100) * reading.densityKgPerM3;
    densityFit = closeness(
      reading.densityKgPerM3,
      s.density.nominal,
      s.density.min,
      s.density.max,
      du,
    );
    score *= densityFit;
  }
  return { score, sigma, spread, corrected, densityFit };
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
  const s = alloyScoring(alloy, bases);
  return s && describeScore(reading, s, scorePrepared(reading, s));
}

/** An alloy's own figures in words, the same for every reading: written once per prepared table. */
interface AlloyWords {
  /** Its reference temperature, e.g. "20 °C". */
  at: string;
  /** Its conductivity range, e.g. "27.0–29.0 %IACS". */
  range: string;
  /** Its nominal density, e.g. "8.53 g/cm³". */
  density: string | null;
}

const alloyWordsMemo = new WeakMap<AlloyScoring, AlloyWords>();

/** "16.3 %IACS read at 60 °C": the reading as given, before correction. */
function readingAt(sPerM: number, kelvin: number): string {
  return `${formatIacs(sPerM)} %IACS read at ${formatCelsius(kelvin)}`;
}

function alloyWords(s: AlloyScoring): AlloyWords {
  let words = alloyWordsMemo.get(s);
  if (!words) {
    words = {
      at: formatCelsius(s.referenceK),
      range: formatIacsRange(s.conductivity.min, s.conductivity.max),
      density: s.density ? formatGPerCm3(s.density.nominal) : null,
    };
    alloyWordsMemo.set(s, words);
  }
  return words;
}

/**
 * Puts words to a comparison already scored ({@link scorePrepared}): how the reading was
 * corrected and where it lies against the alloy's ranges. The costly part of a match (strings for
 * every reason), so POST /match writes them only for the candidates it answers with.
 */
export function describeScore(
  reading: MatchReading,
  s: AlloyScoring,
  prepared: PreparedScore,
): CandidateScore {
  const { score, sigma, spread, corrected, densityFit } = prepared;
  const alloy = s.alloy;
  const reasons: string[] = [];
  const measuredK = reading.temperatureK ?? s.referenceK;
  const read = reading.conductivitySPerM;
  const words = alloyWords(s);
  const at = words.at;

  let correction: TemperatureCorrection;
  if (!corrected) {
    correction = {
      kind: 'none',
      rule: `read at the reference temperature (${at}): nothing to correct`,
    };
  } else if (s.alpha.kind === 'recorded') {
    const recorded = s.alpha.alphaPerK;
    correction = { kind: 'recorded', alphaPerK: recorded };
    reasons.push(
      `${readingAt(read, measuredK)} corrects to ${formatIacs(sigma)} %IACS at ${at} (α = ${recorded.toPrecision(3)} /K)`,
    );
  } else if (s.alpha.kind === 'estimated') {
    const estimate = s.alpha.estimate;
    const rule = `Matthiessen's rule from ${estimate.base.from}: α ≈ α_base·ρ_base/ρ_alloy = ${estimate.lowPerK.toPrecision(2)} /K, up to ${estimate.highPerK.toPrecision(2)} /K`;
    correction = { kind: 'estimated', alphaPerK: estimate.alphaPerK, rule };
    reasons.push(
      `no temperature coefficient on record: estimated by ${rule}; ${readingAt(read, measuredK)} corrects to ${formatIacs(spread[0])}–${formatIacs(spread[1])} %IACS at ${at}`,
    );
  } else {
    correction = {
      kind: 'none',
      rule: `no coefficient on record and no base metal to estimate one: α taken anywhere from ${UNKNOWN_ALPHA_BOUNDS[0]} to ${UNKNOWN_ALPHA_BOUNDS[1]} /K and the score halved`,
    };
    reasons.push(
      `no temperature coefficient on record and none to estimate: the reading at ${formatCelsius(measuredK)} could be ${formatIacs(spread[0])}–${formatIacs(spread[1])} %IACS at ${at}; ranked at half its score`,
    );
  }

  const { min, max } = s.conductivity;
  if (spread[1] >= min && spread[0] <= max) {
    reasons.push(`${formatIacs(sigma)} %IACS at ${at} lies inside ${words.range}`);
  } else {
    const side = spread[1] < min ? 'below' : 'above';
    const gap = spread[1] < min ? min - spread[1] : spread[0] - max;
    reasons.push(
      `${formatIacs(sigma)} %IACS at ${at} lies ${formatIacs(gap)} %IACS ${side} ${words.range}`,
    );
  }

  if (densityFit !== null && reading.densityKgPerM3 !== undefined && s.density) {
    const given = formatGPerCm3(reading.densityKgPerM3);
    reasons.push(
      densityFit > 0.5
        ? `density ${given} matches ${words.density}`
        : `density ${given} is off the handbook ${words.density}`,
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
    conductivityRangeSPerM: s.conductivity,
    densityRangeKgPerM3: s.density,
    correction,
    reasons,
  };
}
