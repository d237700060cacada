import { Link } from 'react-router-dom';
import { FromMemoryBadge, MagneticBadge } from '../../../components/badges';
import { UnitSwitcher } from '../../../components/unit-switcher';
import type { MatchResult } from '../../../lib/api-types';
import {
  conductivityQuantityName,
  formatConductivity,
  formatDensity,
  formatNumber,
} from '../../../lib/format';
import { useUnitPreferences } from '../../../lib/unit-preferences';
import { reasonInUnits } from '../reason-units';

/** Ranked candidates, each with the plain reasons the score rests on. */
export function CandidateList({ result }: { result: MatchResult }) {
  const [units] = useUnitPreferences();
  const quantity = conductivityQuantityName(units.conductivity);
  const reading = result.reading;
  const summary = (
    <div className="flex flex-col gap-2 rounded-md bg-patina-50 p-3 text-sm">
      <p>
        Reading: {quantity.toLowerCase()}{' '}
        <span className="tabular-nums">
          {formatConductivity(reading.conductivitySPerM, units.conductivity)}
        </span>
        {reading.densityKgPerM3 ? (
          <>
            , density{' '}
            <span className="tabular-nums">
              {formatDensity(reading.densityKgPerM3, units.density)}
            </span>
          </>
        ) : null}
        , uncertainty {formatNumber(reading.uncertaintyPercent, 2)} %.
      </p>
      <UnitSwitcher />
    </div>
  );
  if (result.candidates.length === 0) {
    return (
      <>
        {summary}
        <div
          role="status"
          className="rounded-md border border-dashed border-patina-300 p-6 text-center"
        >
          <p className="font-medium">No alloy in the table fits this reading.</p>
          <p className="text-sm text-ink/70">
            Check the unit, the temperature, and whether the piece is plated or coated.
          </p>
        </div>
      </>
    );
  }
  return (
    <>
      {summary}
      <ol aria-label="Candidates, best first" className="flex flex-col gap-3">
        {result.candidates.map((c, index) => (
          <li key={c.slug} className="rounded-md border border-patina-100 bg-white p-4">
            <div className="flex flex-wrap items-baseline justify-between gap-2">
              <h3 className="flex flex-wrap items-center gap-2 font-semibold">
                <span className="text-copper-500">{index + 1}.</span>
                <Link to={`/alloys/${c.slug}`} className="text-patina-700 hover:underline">
                  {c.name}
                </Link>
                <span className="text-sm font-normal text-ink/70">{c.uns ?? 'no UNS'}</span>
                {c.magnetic ? <MagneticBadge /> : null}
                {c.fromMemory ? <FromMemoryBadge /> : null}
              </h3>
              <div className="flex items-center gap-2 text-sm">
                <span className="text-ink/70">fit</span>
                <meter
                  min={0}
                  max={1}
                  value={c.score}
                  className="h-2 w-24"
                  aria-label={`fit of ${c.name}`}
                />
                <span className="tabular-nums">{formatNumber(c.score, 2)}</span>
              </div>
            </div>
            <p className="mt-2 text-sm">
              {quantity} of the reading at this alloy&apos;s reference temperature:{' '}
              <span className="tabular-nums">
                {formatConductivity(c.correctedConductivitySPerM, units.conductivity)}
              </span>
            </p>
            <p className="text-sm text-ink/70">{correctionInWords(c.correction)}</p>
            <ul className="mt-1 list-disc pl-5 text-sm">
              {c.reasons.map((reason) => (
                <li key={reason}>{reasonInUnits(reason, units)}</li>
              ))}
            </ul>
          </li>
        ))}
      </ol>
    </>
  );
}

type Correction = MatchResult['candidates'][number]['correction'];

/** Whether and how the reading was brought to this alloy's reference temperature, in words. */
function correctionInWords(c: Correction): string {
  const alpha =
    c.alphaPerK === undefined ? '' : ` (α = ${formatNumber(c.alphaPerK * 1e3, 3)} × 10⁻³ /K)`;
  switch (c.kind) {
    case 'recorded':
      return `Temperature: corrected with this alloy's own coefficient${alpha}.`;
    case 'estimated':
      return `Temperature: corrected with an estimated coefficient${alpha}, by Matthiessen's rule; the fit allows for its uncertainty.`;
    case 'none':
      return `Temperature: not corrected${c.rule ? `, ${c.rule}` : ''}.`;
  }
}
