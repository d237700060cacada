import { formatMetres } from '../../../lib/chart-format';
import { formatNumber } from '../../../lib/format';
import type { LaunchResult } from '../api/run-launch';

function Figure({ label, value }: { label: string; value: string }) {
  return (
    <div className="rounded border border-patina-100 bg-white px-3 py-2">
      <dt className="text-xs uppercase tracking-wide text-ink/60">{label}</dt>
      <dd className="font-semibold tabular-nums">{value}</dd>
    </div>
  );
}

/** Peaks, flight and efficiency of one launch, and where its stored energy went. */
export function LaunchSummary({ result, name }: { result: LaunchResult; name: string }) {
  const e = result.energy;
  const parts = [
    { label: 'coil and circuit loss', value: e.coilLossJ, colour: '#b8642e' },
    { label: 'heat in the blank', value: e.blankLossJ, colour: '#e3a677' },
    { label: 'kinetic', value: e.kineticJ, colour: '#1d5c51' },
    { label: 'left over', value: Math.max(0, e.residualJ), colour: '#8cc5b8' },
  ];
  return (
    <section aria-label={`Launch of ${name}`} className="flex flex-col gap-3">
      <h3 className="font-semibold">{name}</h3>
      <dl className="grid grid-cols-2 gap-2 sm:grid-cols-4">
        <Figure
          label="Peak current"
          value={`${formatNumber(result.peakCurrentA)} A at ${formatNumber(result.peakCurrentTimeS * 1e6)} µs`}
        />
        <Figure label="Peak force" value={`${formatNumber(result.peakForceN)} N`} />
        <Figure label="Impulse" value={`${formatNumber(result.impulseNs * 1e3)} mN·s`} />
        <Figure label="Exit speed" value={`${formatNumber(result.exitSpeedMPerS)} m/s`} />
        <Figure label="Height" value={formatMetres(result.heightM)} />
        <Figure
          label="Range"
          value={result.rangeM > 1e-9 ? formatMetres(result.rangeM) : '— (straight up)'}
        />
        <Figure label="Efficiency" value={`${formatNumber(result.efficiency * 100)} %`} />
        <Figure label="Blank mass" value={`${formatNumber(result.massKg * 1e3)} g`} />
      </dl>
      <div>
        <p className="mb-1 text-sm font-medium">
          Energy ledger: {formatNumber(e.storedJ)} J stored
        </p>
        <div
          className="flex h-5 w-full overflow-hidden rounded"
          role="img"
          aria-label={`Energy ledger as a bar: ${parts.map((p) => `${p.label} ${formatNumber((p.value / e.storedJ) * 100)} %`).join(', ')}; the table below gives the joules`}
        >
          {parts.map((p) => (
            <div
              key={p.label}
              style={{ width: `${(p.value / e.storedJ) * 100}%`, background: p.colour }}
            />
          ))}
        </div>
        <table className="mt-2 text-sm">
          <caption className="sr-only">Energy ledger of {name}</caption>
          <tbody>
            {parts.map((p) => (
              <tr key={p.label}>
                <th scope="row" className="pr-3 text-left font-normal">
                  <span
                    className="mr-1.5 inline-block h-2.5 w-2.5 rounded-sm"
                    style={{ background: p.colour }}
                  />
                  {p.label}
                </th>
                <td className="pr-3 text-right tabular-nums">{formatNumber(p.value, 3)} J</td>
                <td className="text-right tabular-nums text-ink/60">
                  {formatNumber((p.value / e.storedJ) * 100, 3)} %
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      {result.warnings.map((w) => (
        <p key={w.code} className="text-sm text-copper-700">
          {w.message}
        </p>
      ))}
    </section>
  );
}
