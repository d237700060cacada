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
import type { LaunchResult } from '../api/run-launch';

/** Coil current and force on the blank against time, on two axes. */
export function CurrentForceChart({ result, name }: { result: LaunchResult; name: string }) {
  const rows = result.series.map((p) => ({
    t: p.timeS * 1e6,
    current: p.coilCurrentA,
    force: p.forceN,
  }));
  return (
    <figure className="rounded-md border border-patina-100 bg-white p-3">
      <figcaption className="mb-2 text-sm font-semibold">
        Current and force against time: {name}
      </figcaption>
      <div
        role="img"
        aria-label={`Chart of coil current and force against time for ${name}`}
        className="h-72"
      >
        <ResponsiveContainer width="100%" height="100%">
          <LineChart data={rows} margin={{ top: 8, right: 8, bottom: 20, left: 8 }}>
            <CartesianGrid stroke="#d5ebe6" />
            <XAxis
              dataKey="t"
              type="number"
              domain={[0, 'dataMax']}
              tickFormatter={(v) => Number(v).toFixed(0)}
              label={{ value: 'time (µs)', position: 'insideBottom', offset: -12 }}
            />
            <YAxis
              yAxisId="i"
              label={{ value: 'current (A)', angle: -90, position: 'insideLeft' }}
            />
            <YAxis
              yAxisId="f"
              orientation="right"
              label={{ value: 'force (N)', angle: 90, position: 'insideRight' }}
            />
            <Tooltip
              labelFormatter={(t) => `${Number(t).toFixed(1)} µs`}
              formatter={(v) => Number(v).toPrecision(4)}
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
