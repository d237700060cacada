import { restsOnMemory, type AlloyRecord } from '../../shared/catalogue/alloy-record';
import { scoreCandidate, type MatchReading } from '../../shared/match/score';

export interface MatchCandidate {
  slug: string;
  name: string;
  uns: string | null;
  family: string;
  magnetic: boolean;
  fromMemory: boolean;
  score: number;
  correctedConductivitySPerM: number;
  reasons: string[];
}

/** Candidates below this score are noise: a reading some three uncertainties outside the range. */
const MIN_SCORE = 0.005;

/** Ranks every alloy against a reading, best first, and keeps the first `limit`. */
export function matchReading(
  alloys: AlloyRecord[],
  reading: MatchReading,
  limit: number,
): MatchCandidate[] {
  const candidates: MatchCandidate[] = [];
  for (const alloy of alloys) {
    const result = scoreCandidate(reading, alloy);
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
      reasons: result.reasons,
    });
  }
  candidates.sort((a, b) => b.score - a.score || a.name.localeCompare(b.name));
  return candidates.slice(0, limit);
}
