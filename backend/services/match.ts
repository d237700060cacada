import { restsOnMemory, type AlloyRecord } from '../../shared/catalogue/alloy-record';
import { formatCelsius } from '../../shared/match/format';
import { scoreCandidate, type MatchReading, type ScoredRange } from '../../shared/match/score';
import {
  baseMetalsFrom,
  type TemperatureCorrection,
} from '../../shared/match/temperature-estimate';
import { OutsideModelError } from '../../shared/physics/errors';
import { InvalidQuantityError } from '../../shared/units/errors';
import {
  LINEAR_LAW_RANGE_K,
  withinLinearLawRange,
} from '../../shared/units/temperature-correction';

export interface MatchCandidate {
  slug: string;
  name: string;
  uns: string | null;
  family: string;
  magnetic: boolean;
  fromMemory: boolean;
  score: number;
  correctedConductivitySPerM: number;
  conductivityRangeSPerM: ScoredRange;
  densityRangeKgPerM3: ScoredRange | null;
  correction: TemperatureCorrection;
  reasons: string[];
}

/** Candidates below this score are noise: a reading some three uncertainties outside the range. */
export const MIN_SCORE = 0.005;

/**
 * Ranks every alloy against a reading, best first, and keeps the first `limit`. A reading taken
 * where the linear temperature correction does not hold is refused (OutsideModelError on
 * /body/temperature, a 422) rather than corrected into nonsense.
 */
export function matchReading(
  alloys: AlloyRecord[],
  reading: MatchReading,
  limit: number,
): MatchCandidate[] {
  const t = reading.temperatureK;
  if (t !== undefined && !withinLinearLawRange(t)) {
    const { min, max } = LINEAR_LAW_RANGE_K;
    throw new OutsideModelError(
      '/body/temperature',
      `a reading at ${formatCelsius(t)} (${Number(t.toFixed(2))} K) is outside ${formatCelsius(min)} to ${formatCelsius(max)} (${min} K to ${max} K), where a linear temperature coefficient corrects conductivity`,
    );
  }
  const candidates: MatchCandidate[] = [];
  const bases = baseMetalsFrom(alloys);
  for (const alloy of alloys) {
    let result;
    try {
      result = scoreCandidate(reading, alloy, bases);
    } catch (error) {
      // This alloy's own coefficient (a curated figure) turns the linear law negative here:
      // it cannot be compared with this reading, the others still can.
      if (error instanceof InvalidQuantityError) continue;
      throw error;
    }
    if (!result || result.score < MIN_SCORE) continue;
    candidates.push({
      slug: alloy.slug,
      name: alloy.name,
      uns: alloy.uns,
      family: alloy.family,
      magnetic: alloy.magnetic,
      fromMemory: restsOnMemory(alloy),
      score: Number(result.score.toFixed(4)),
      correctedConductivitySPerM: result.correctedConductivitySPerM,
      conductivityRangeSPerM: result.conductivityRangeSPerM,
      densityRangeKgPerM3: result.densityRangeKgPerM3,
      correction: result.correction,
      reasons: result.reasons,
    });
  }
  candidates.sort((a, b) => b.score - a.score || a.name.localeCompare(b.name));
  return candidates.slice(0, limit);
}
