import { formatHertz, formatMetres, seriesColours } from '../../../lib/chart-format';
import {
  conductivityOverDensityName,
  conductivityQuantityName,
  formatConductivity,
  formatConductivityOverDensity,
  formatDensity,
  formatNumber,
} from '../../../lib/format';
import type { UnitPreferences } from '../../../lib/unit-preferences';
import type { BlankResult } from '../worker/protocol';

/** The figures behind the charts, one column per blank. */
export function ComparisonTable({
  results,
  units,
  probeHz,
}: {
  results: BlankResult[];
  units: UnitPreferences;
  probeHz: number;
}) {
  const at = (r: BlankResult) => {
    let best = r.points[0]!;
    for (const p of r.points)
      if (
        Math.abs(Math.log(p.frequencyHz / probeHz)) < Math.abs(Math.log(best.frequencyHz / probeHz))
      )
        best = p;
    return best;
  };
  const quantity = conductivityQuantityName(units.conductivity).toLowerCase();
  const rows: Array<[string, (r: BlankResult) => string]> = [
    ['Mass', (r) => `${formatNumber(r.massKg * 1e3)} g`],
    ['Mean density', (r) => formatDensity(r.densityKgPerM3, units.density)],
    [
      `Thickness-weighted ${quantity}`,
      (r) => formatConductivity(r.meanConductivitySPerM, units.conductivity),
    ],
    [
      conductivityOverDensityName,
      (r) => formatConductivityOverDensity(r.conductivityOverDensity, units),
    ],
    [
      `Apparent ${quantity} at ${formatHertz(probeHz)}`,
      (r) => formatConductivity(at(r).apparentConductivitySPerM, units.conductivity),
    ],
    [
      `Fit residual at ${formatHertz(probeHz)} (relative, no unit)`,
      (r) => formatNumber(at(r).fitResidual, 2),
    ],
    [
      'δ = face layer at',
      (r) => (r.faceDepthFrequencyHz === null ? '— (solid)' : formatHertz(r.faceDepthFrequencyHz)),
    ],
    [
      'Launch height',
      (r) => (r.launchHeightM === null ? 'not computed' : formatMetres(r.launchHeightM)),
    ],
  ];
  return (
    <div className="overflow-x-auto rounded-md border border-patina-100 bg-white">
      <table className="w-full text-sm sm:min-w-[36rem]">
        <caption className="sr-only">Figures of the compared blanks</caption>
        <thead className="bg-patina-50">
          <tr>
            <th scope="col" className="px-3 py-2 text-left">
              Figure
            </th>
            {results.map((r, i) => (
              <th
                key={r.id}
                scope="col"
                className="px-3 py-2 text-right"
                style={{ color: seriesColours[i] }}
              >
                {r.name}
              </th>
            ))}
          </tr>
        </thead>
        <tbody>
          {rows.map(([label, value]) => (
            <tr key={label} className="border-t border-patina-50">
              <th scope="row" className="px-3 py-1.5 text-left font-medium">
                {label}
              </th>
              {results.map((r) => (
                <td key={r.id} className="px-3 py-1.5 text-right tabular-nums">
                  {value(r)}
                </td>
              ))}
            </tr>
          ))}
        </tbody>
      </table>
      {results.some((r) => r.launchWarning || r.warnings.length) ? (
        <ul
          aria-label="Warnings"
          className="flex flex-col gap-1 border-t border-patina-50 px-3 py-2 text-sm text-copper-700"
        >
          {results.flatMap((r) => [
            ...r.warnings.map((w) => (
              <li key={`${r.id}-${w.code}`}>
                {r.name}: {w.message}
              </li>
            )),
            ...(r.launchWarning
              ? [
                  <li key={`${r.id}-launch`}>
                    {r.name}, launch: {r.launchWarning}
                  </li>,
                ]
              : []),
          ])}
        </ul>
      ) : null}
    </div>
  );
}
