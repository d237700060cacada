import {
  CartesianGrid,
  Legend,
  Line,
  LineChart,
  ReferenceLine,
  ResponsiveContainer,
  Tooltip,
  XAxis,
  YAxis,
} from 'recharts';
import { percentIacs } from '../../../../shared/units/conductivity';
import { decadeTicks, formatHertz, seriesColours } from '../../../lib/chart-format';
import type { BlankResult } from '../worker/protocol';

/** Apparent conductivity against frequency, one line per blank, with its limits dashed. */
export function ApparentConductivityChart({ results }: { results: BlankResult[] }) {
  const frequencies = results[0]?.points.map((p) => p.frequencyHz) ?? [];
  const rows = frequencies.map((f, i) => {
    const row: Record<string, number> = { f };
    for (const r of results) row[r.id] = percentIacs(r.points[i]!.apparentConductivitySPerM);
    return row;
  });
  const ticks = decadeTicks(frequencies[0] ?? 1, frequencies.at(-1) ?? 10);
  return (
    <figure className="rounded-md border border-patina-100 bg-white p-3">
      <figcaption className="mb-2 text-sm font-semibold">
        Apparent conductivity against frequency
      </figcaption>
      <div
        role="img"
        aria-label="Chart of apparent conductivity in %IACS against frequency for each blank"
        className="h-80"
      >
        <ResponsiveContainer width="100%" height="100%">
          <LineChart data={rows} margin={{ top: 8, right: 16, bottom: 20, left: 8 }}>
            <CartesianGrid stroke="#d5ebe6" />
            <XAxis
              dataKey="f"
              type="number"
              scale="log"
              domain={['dataMin', 'dataMax']}
              ticks={ticks}
              tickFormatter={formatHertz}
              label={{ value: 'frequency', position: 'insideBottom', offset: -12 }}
            />
            <YAxis
              label={{ value: '%IACS', angle: -90, position: 'insideLeft' }}
              domain={[0, 'auto']}
            />
            <Tooltip
              labelFormatter={(f) => formatHertz(Number(f))}
              formatter={(v) => `${Number(v).toFixed(2)} %IACS`}
            />
            <Legend verticalAlign="top" />
            {results.map((r, i) => (
              <Line
                key={r.id}
                dataKey={r.id}
                name={r.name}
                stroke={seriesColours[i]}
                dot={false}
                strokeWidth={2}
                isAnimationActive={false}
              />
            ))}
            {results.flatMap((r, i) => [
              r.limits.thicknessWeightedMeanSPerM !== null ? (
                <ReferenceLine
                  key={`${r.id}-mean`}
                  y={percentIacs(r.limits.thicknessWeightedMeanSPerM)}
                  stroke={seriesColours[i]}
                  strokeDasharray="6 4"
                />
              ) : null,
              r.points.length && r.limits.surfaceLayerSPerM !== r.limits.lowFrequencySPerM ? (
                <ReferenceLine
                  key={`${r.id}-face`}
                  y={percentIacs(r.limits.surfaceLayerSPerM)}
                  stroke={seriesColours[i]}
                  strokeDasharray="2 4"
                />
              ) : null,
              r.faceDepthFrequencyHz !== null &&
              r.faceDepthFrequencyHz >= (frequencies[0] ?? 0) &&
              r.faceDepthFrequencyHz <= (frequencies.at(-1) ?? 0) ? (
                <ReferenceLine
                  key={`${r.id}-depth`}
                  x={r.faceDepthFrequencyHz}
                  stroke={seriesColours[i]}
                  strokeDasharray="1 3"
                  label={{
                    value: 'δ = face layer',
                    position: 'insideTopLeft',
                    fill: seriesColours[i],
                    fontSize: 11,
                  }}
                />
              ) : null,
            ])}
          </LineChart>
        </ResponsiveContainer>
      </div>
      <p className="mt-1 text-xs text-ink/60">
        Dashed: the thickness-weighted mean (low-frequency limit). Dotted horizontal: the face layer
        (high-frequency limit). Dotted vertical: where the standard depth equals the face
        layer&apos;s thickness.
      </p>
    </figure>
  );
}

/** The normalised impedance plane: ΔR/X0 across, X/X0 up, each blank traced over the sweep. */
export function ImpedancePlaneChart({ results }: { results: BlankResult[] }) {
  return (
    <figure className="rounded-md border border-patina-100 bg-white p-3">
      <figcaption className="mb-2 text-sm font-semibold">Normalised impedance plane</figcaption>
      <div
        role="img"
        aria-label="Chart of normalised reactance against normalised resistance for each blank"
        className="h-80"
      >
        <ResponsiveContainer width="100%" height="100%">
          <LineChart margin={{ top: 8, right: 16, bottom: 20, left: 8 }}>
            <CartesianGrid stroke="#d5ebe6" />
            <XAxis
              dataKey="x"
              type="number"
              domain={[0, 'auto']}
              tickFormatter={(v) => Number(v).toFixed(2)}
              label={{ value: 'ΔR / X0', position: 'insideBottom', offset: -12 }}
            />
            <YAxis
              dataKey="y"
              type="number"
              domain={['auto', 'auto']}
              tickFormatter={(v) => Number(v).toFixed(2)}
              label={{ value: 'X / X0', angle: -90, position: 'insideLeft' }}
            />
            <Tooltip formatter={(v) => Number(v).toFixed(4)} />
            <Legend verticalAlign="top" />
            {results.map((r, i) => (
              <Line
                key={r.id}
                name={r.name}
                data={r.points.map((p) => ({
                  x: p.normalizedResistance,
                  y: p.normalizedReactance,
                }))}
                dataKey="y"
                stroke={seriesColours[i]}
                dot={false}
                strokeWidth={2}
                isAnimationActive={false}
              />
            ))}
          </LineChart>
        </ResponsiveContainer>
      </div>
    </figure>
  );
}
