import { valueOf, type AlloyRecord } from '../catalogue/alloy-record';
import { conductivityAtReference } from '../units/temperature-correction';
import { formatCelsius, formatGPerCm3, formatIacs, formatIacsRange } from './format';

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
  reasons: string[];
}

/** Relative uncertainty assumed for a density figure (weighing and measuring a piece), percent. */
export const DENSITY_UNCERTAINTY_PERCENT = 1;
/** Half-width used when a handbook gives a nominal only, as a fraction of it. */
const DEFAULT_HALF_RANGE = 0.02;

/**
 * How far a value lies outside [min, max] in standard uncertainties, folded into 0..1 by a
 * Gaussian (1 inside the range), times a gentle preference for values near the nominal, so that
 * two alloys whose ranges both contain the reading still rank by closeness.
 */
function closeness(value: number, nominal: number, min: number, max: number, u: number): number {
  const outside = Math.max(0, min - value, value - max);
  const width = Math.hypot((max - min) / 2, u);
  const nearNominal = Math.exp(-0.5 * ((value - nominal) / width) ** 2);
  return Math.exp(-0.5 * (outside / u) ** 2) * (0.75 + 0.25 * nearNominal);
}

/**
 * Scores how well a reading fits one alloy: the reading is corrected to the table's reference
 * temperature with the alloy's own coefficient (linear law, IEC 60028), compared with the
 * handbook range within the stated uncertainty, and likewise for density when one is given.
 * The method is ours; its scale (0..1) ranks candidates and is no probability.
 */
export function scoreCandidate(reading: MatchReading, alloy: AlloyRecord): CandidateScore | null {
  const conductivity = valueOf(alloy, 'conductivity');
  if (!conductivity) return null;
  const reasons: string[] = [];
  const referenceK = conductivity.referenceTemperatureK;
  const measuredK = reading.temperatureK ?? referenceK;
  const alpha = valueOf(alloy, 'resistivity_temperature_coefficient')?.nominal;

  let sigma = reading.conductivitySPerM;
  if (Math.abs(measuredK - referenceK) > 0.05) {
    if (alpha !== undefined) {
      sigma = conductivityAtReference(reading.conductivitySPerM, measuredK, referenceK, alpha);
      reasons.push(
        `${formatIacs(reading.conductivitySPerM)} %IACS read at ${formatCelsius(measuredK)} corrects to ${formatIacs(sigma)} %IACS at ${formatCelsius(referenceK)} (α = ${alpha.toPrecision(3)} /K)`,
      );
    } else {
      reasons.push(
        `no temperature coefficient on record: the reading at ${formatCelsius(measuredK)} is compared uncorrected with the ${formatCelsius(referenceK)} value`,
      );
    }
  }

  const nominal = conductivity.nominal;
  const min = conductivity.min ?? nominal * (1 - DEFAULT_HALF_RANGE);
  const max = conductivity.max ?? nominal * (1 + DEFAULT_HALF_RANGE);
  const u = (reading.uncertaintyPercent / 100) * sigma;
  let score = closeness(sigma, nominal, min, max, u);
  const at = formatCelsius(referenceK);
  if (sigma >= min && sigma <= max) {
    reasons.push(`${formatIacs(sigma)} %IACS at ${at} lies inside ${formatIacsRange(min, max)}`);
  } else {
    const side = sigma < min ? 'below' : 'above';
    const gap = sigma < min ? min - sigma : sigma - max;
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
    reasons,
  };
}
