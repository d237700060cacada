import { restsOnMemory, type AlloyRecord } from '../../shared/catalogue/alloy-record';
import { formatCelsius } from '../../shared/match/format';
import {
  alloyScoring,
  describeScore,
  scorePrepared,
  type AlloyScoring,
  type MatchReading,
  type PreparedScore,
  type ScoredRange,
} from '../../shared/match/score';
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
 * What every match needs from the table, worked out once per table rather than once per
 * reading: each alloy's ranges and how its temperature coefficient is known, against the base
 * metals of the whole table. The Catalogue keeps one for as long as the table is unchanged.
 */
export function prepareMatch(alloys: AlloyRecord[]): AlloyScoring[] {
  const bases = baseMetalsFrom(alloys);
  return alloys.map((a) => alloyScoring(a, bases)).filter((s): s is AlloyScoring => s !== null);
}

/** Ranks every alloy against a reading ({@link matchPrepared}), preparing the table first. */
export function matchReading(
  alloys: AlloyRecord[],
  reading: MatchReading,
  limit: number,
): MatchCandidate[] {
  return matchPrepared(prepareMatch(alloys), reading, limit);
}

/**
 * Ranks every alloy against a reading, best first, and keeps the first `limit`. A reading taken
 * where the linear temperature correction does not hold is refused (OutsideModelError on
 * /body/temperature, a 422) rather than corrected into nonsense. Every alloy is scored in
 * arithmetic only; the reasons in words are written for the candidates kept.
 */
export function matchPrepared(
  table: AlloyScoring[],
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
  const scored: Array<{ s: AlloyScoring; prepared: PreparedScore; score: number }> = [];
  for (const s of table) {
    let prepared: PreparedScore;
    try {
      prepared = scorePrepared(reading, s);
    } catch (error) {
      // This alloy's own coefficient (a curated figure) turns the linear law negative here:
      // it cannot be compared with this reading, the others still can.
      if (error instanceof InvalidQuantityError) continue;
      throw error;
    }
    if (prepared.score < MIN_SCORE) continue;
    scored.push({ s, prepared, score: Number(prepared.score.toFixed(4)) });
  }
  scored.sort((a, b) => b.score - a.score || a.s.alloy.name.localeCompare(b.s.alloy.name));
  return scored.slice(0, limit).map(({ s, prepared, score }) => {
    const alloy = s.alloy;
    const words = describeScore(reading, s, prepared);
    return {
      slug: alloy.slug,
      name: alloy.name,
      uns: alloy.uns,
      family: alloy.family,
      magnetic: alloy.magnetic,
      fromMemory: restsOnMemory(alloy),
      score,
      correctedConductivitySPerM: words.correctedConductivitySPerM,
      conductivityRangeSPerM: words.conductivityRangeSPerM,
      densityRangeKgPerM3: words.densityRangeKgPerM3,
      correction: words.correction,
      reasons: words.reasons,
    };
  });
}
