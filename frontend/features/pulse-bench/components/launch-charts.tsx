import {
  CartesianGrid,
  Legend,
  Line,
  LineChart,
  ResponsiveContainer,
  Tooltip,
  XAxis,
  YAxis,
} from 'recharts';
import { tickNumber } from '../../../lib/chart-format';
import { formatNumber } from '../../../lib/format';
import type { LaunchResult } from '../api/run-launch';

/** Coil current and force on the blank against time, on two axes. */
export function CurrentForceChart({ result, name }: { result: LaunchResult; name: string }) {
  const rows = result.series.map((p) => ({
    t: p.timeS * 1e6,
    current: p.coilCurrentA,
    force: p.forceN,
  }));
  const peakForceAt = result.series.reduce(
    (best, p) => (p.forceN > best.forceN ? p : best),
    result.series[0] ?? { timeS: 0, forceN: 0 },
  );
  const end = result.series.at(-1)?.timeS ?? 0;
  // The text alternative: what a person reads off the chart, in one line.
  const summary = `Coil current peaks at ${formatNumber(result.peakCurrentA)} A after ${formatNumber(result.peakCurrentTimeS * 1e6)} µs; the force on the blank peaks at ${formatNumber(result.peakForceN)} N after ${formatNumber(peakForceAt.timeS * 1e6)} µs; the trace runs ${formatNumber(end * 1e6)} µs.`;
  return (
    <figure className="rounded-md border border-patina-100 bg-white p-3">
      <figcaption className="mb-2 text-sm">
        <span className="block font-semibold">Current and force against time: {name}</span>
        <span className="block text-xs text-ink/70">{summary}</span>
      </figcaption>
      <div
        role="img"
        aria-label={`Chart of coil current (A) and force (N) against time (µs) for ${name}. ${summary}`}
        className="h-72"
      >
        <ResponsiveContainer width="100%" height="100%">
          <LineChart
            accessibilityLayer={false}
            data={rows}
            margin={{ top: 8, right: 8, bottom: 20, left: 8 }}
          >
            <CartesianGrid stroke="#d5ebe6" />
            <XAxis
              dataKey="t"
              type="number"
              domain={[0, 'dataMax']}
              tickFormatter={tickNumber}
              label={{ value: 'time (µs)', position: 'insideBottom', offset: -12 }}
            />
            <YAxis
              yAxisId="i"
              tickFormatter={tickNumber}
              label={{ value: 'current (A)', angle: -90, position: 'insideLeft' }}
            />
            <YAxis
              yAxisId="f"
              orientation="right"
              tickFormatter={tickNumber}
              label={{ value: 'force (N)', angle: 90, position: 'insideRight' }}
            />
            <Tooltip
              labelFormatter={(t) => `${formatNumber(Number(t))} µs`}
              formatter={(v, key) =>
                `${formatNumber(Number(v))} ${String(key).includes('current') ? 'A' : 'N'}`
              }
            />
            <Legend verticalAlign="top" />
            <Line
              yAxisId="i"
              dataKey="current"
              name="coil current (A)"
              stroke="#1d5c51"
              dot={false}
              strokeWidth={2}
              isAnimationActive={false}
            />
            <Line
              yAxisId="f"
              dataKey="force"
              name="force on blank (N)"
              stroke="#b8642e"
              dot={false}
              strokeWidth={2}
              isAnimationActive={false}
            />
          </LineChart>
        </ResponsiveContainer>
      </div>
    </figure>
  );
}
