import {
  CartesianGrid,
  Line,
  LineChart,
  ResponsiveContainer,
  Tooltip,
  XAxis,
  YAxis,
} from 'recharts';
import { skinDepth } from '../../../../shared/physics/skin-depth';
import { decadeTicks, formatHertz, formatMetres, tickNumber } from '../../../lib/chart-format';
import { formatNumber } from '../../../lib/format';

/** Frequencies eddy-current sorters and conductivity meters commonly work at (common practice, no source). */
const TEST_FREQUENCIES = [1e3, 10e3, 60e3, 100e3, 500e3, 1e6, 5e6];

/** Standard depth of penetration of this alloy at the common test frequencies, table and chart. */
export function SkinDepthSection({
  conductivitySPerM,
  relativePermeability,
  magnetic,
}: {
  conductivitySPerM: number;
  relativePermeability: number;
  magnetic: boolean;
}) {
  const curve = Array.from({ length: 61 }, (_, i) => {
    const f = 100 * 10 ** (i / 10);
    return { f, depthMm: skinDepth(f, conductivitySPerM, relativePermeability) * 1e3 };
  });
  return (
    <section aria-labelledby="depth-title" className="flex flex-col gap-2">
      <h2 id="depth-title" className="text-lg font-semibold">
        Skin depth
      </h2>
      <div className="grid gap-4 lg:grid-cols-[20rem_1fr]">
        <table className="h-fit rounded-md border border-patina-100 bg-white text-sm">
          <caption className="sr-only">
            Standard depth of penetration at common test frequencies
          </caption>
          <thead className="bg-patina-50">
            <tr>
              <th scope="col" className="px-3 py-2 text-left">
                Frequency
              </th>
              <th scope="col" className="px-3 py-2 text-right">
                Standard depth δ
              </th>
              <th scope="col" className="px-3 py-2 text-right">
                3δ
              </th>
            </tr>
          </thead>
          <tbody>
            {TEST_FREQUENCIES.map((f) => {
              const d = skinDepth(f, conductivitySPerM, relativePermeability);
              return (
                <tr key={f} className="border-t border-patina-50">
                  <th scope="row" className="px-3 py-1.5 text-left font-medium">
                    {formatHertz(f)}
                  </th>
                  <td className="px-3 py-1.5 text-right tabular-nums">{formatMetres(d)}</td>
                  <td className="px-3 py-1.5 text-right tabular-nums">{formatMetres(3 * d)}</td>
                </tr>
              );
            })}
          </tbody>
        </table>
        <figure className="rounded-md border border-patina-100 bg-white p-3">
          <div
            role="img"
            aria-label={`Chart of standard depth of penetration against frequency, 100 Hz to 10 MHz: from ${formatMetres(curve[0]!.depthMm / 1e3)} down to ${formatMetres(curve.at(-1)!.depthMm / 1e3)}; the table beside it lists the values at the common test frequencies`}
            className="h-64"
          >
            <ResponsiveContainer width="100%" height="100%">
              <LineChart
                accessibilityLayer={false}
                data={curve}
                margin={{ top: 8, right: 16, bottom: 20, left: 8 }}
              >
                <CartesianGrid stroke="#d5ebe6" />
                <XAxis
                  dataKey="f"
                  type="number"
                  scale="log"
                  domain={['dataMin', 'dataMax']}
                  ticks={decadeTicks(100, 1e7)}
                  tickFormatter={formatHertz}
                  label={{ value: 'frequency', position: 'insideBottom', offset: -12 }}
                />
                <YAxis
                  dataKey="depthMm"
                  type="number"
                  scale="log"
                  domain={['auto', 'auto']}
                  tickFormatter={tickNumber}
                  label={{ value: 'δ (mm)', angle: -90, position: 'insideLeft' }}
                />
                <Tooltip
                  labelFormatter={(f) => formatHertz(Number(f))}
                  formatter={(v) => `${formatNumber(Number(v))} mm`}
                />
                <Line
                  dataKey="depthMm"
                  name="standard depth"
                  stroke="#1d5c51"
                  dot={false}
                  strokeWidth={2}
                  isAnimationActive={false}
                />
              </LineChart>
            </ResponsiveContainer>
          </div>
          <figcaption className="mt-1 text-xs text-ink/60">
            δ = 1/√(π f µ0 µr σ) with the nominal σ
            {magnetic
              ? ` and µr = ${relativePermeability}, itself uncertain for a magnetic alloy`
              : ''}
            . A part thicker than about 3δ reads as infinitely thick (common practice).
          </figcaption>
        </figure>
      </div>
    </section>
  );
}
