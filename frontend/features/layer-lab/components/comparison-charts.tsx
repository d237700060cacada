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
import { unitLabel } from '../../../../shared/units/codes';
import { FiguresTable } from '../../../components/figures-table';
import {
  decadeTicks,
  domainIncluding,
  formatHertz,
  seriesColours,
  tickNumber,
} from '../../../lib/chart-format';
import {
  conductivityIn,
  conductivityQuantityName,
  formatConductivity,
  formatNumber,
} from '../../../lib/format';
import type { UnitPreferences } from '../../../lib/unit-preferences';
import type { BlankResult } from '../worker/protocol';

/** Frequencies for the text alternative: the decades of the sweep, nearest point to each. */
function samplePoints(results: BlankResult[]): number[] {
  const frequencies = results[0]?.points.map((p) => p.frequencyHz) ?? [];
  if (!frequencies.length) return [];
  const wanted = decadeTicks(frequencies[0]!, frequencies.at(-1)!);
  const picks = new Set<number>([0, frequencies.length - 1]);
  for (const f of wanted) {
    let best = 0;
    frequencies.forEach((g, i) => {
      if (Math.abs(Math.log(g / f)) < Math.abs(Math.log(frequencies[best]! / f))) best = i;
    });
    picks.add(best);
  }
  return [...picks].sort((a, b) => a - b);
}

/** Apparent conductivity against frequency, one line per blank, with its limits dashed. */
export function ApparentConductivityChart({
  results,
  units,
}: {
  results: BlankResult[];
  units: UnitPreferences;
}) {
  const unit = units.conductivity;
  const label = unitLabel(unit);
  const quantity = `apparent ${conductivityQuantityName(unit).toLowerCase()}`;
  const y = (sPerM: number) => conductivityIn(sPerM, unit);
  const frequencies = results[0]?.points.map((p) => p.frequencyHz) ?? [];
  const rows = frequencies.map((f, i) => {
    const row: Record<string, number> = { f };
    for (const r of results) row[r.id] = y(r.points[i]!.apparentConductivitySPerM);
    return row;
  });
  const ticks = decadeTicks(frequencies[0] ?? 1, frequencies.at(-1) ?? 10);
  // The axis holds every curve and every limit line drawn on it (issue 9, item 7).
  const limits = results.flatMap((r) => [
    ...(r.limits.thicknessWeightedMeanSPerM !== null ? [r.limits.thicknessWeightedMeanSPerM] : []),
    r.limits.surfaceLayerSPerM,
  ]);
  const domain = domainIncluding(
    [
      ...results.flatMap((r) => r.points.map((p) => y(p.apparentConductivitySPerM))),
      ...limits.map(y),
    ],
    { floorZero: true },
  );
  const samples = samplePoints(results);
  const title = `${quantity[0]!.toUpperCase()}${quantity.slice(1)} against frequency`;
  return (
    <figure
      className="rounded-md border border-patina-100 bg-white p-3"
      aria-labelledby="apparent-chart-title"
    >
      <figcaption id="apparent-chart-title" className="mb-2 text-sm font-semibold">
        {title} ({label})
      </figcaption>
      <div
        role="img"
        aria-label={`Chart of ${quantity} in ${label} against frequency for ${results.map((r) => r.name).join(' and ')}; the table below the chart lists the figures`}
        className="h-80"
      >
        <ResponsiveContainer width="100%" height="100%">
          <LineChart
            accessibilityLayer={false}
            data={rows}
            margin={{ top: 8, right: 16, bottom: 20, left: 16 }}
          >
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
              label={{ value: label, angle: -90, position: 'insideLeft', offset: -8 }}
              domain={domain}
              allowDataOverflow={false}
              tickFormatter={tickNumber}
            />
            <Tooltip
              labelFormatter={(f) => formatHertz(Number(f))}
              formatter={(v) => `${formatNumber(Number(v))} ${label}`}
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
                  y={y(r.limits.thicknessWeightedMeanSPerM)}
                  stroke={seriesColours[i]}
                  strokeDasharray="6 4"
                />
              ) : null,
              r.points.length && r.limits.surfaceLayerSPerM !== r.limits.lowFrequencySPerM ? (
                <ReferenceLine
                  key={`${r.id}-face`}
                  y={y(r.limits.surfaceLayerSPerM)}
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
      <p className="mt-1 text-xs text-ink/70">
        Dashed: the thickness-weighted mean (low-frequency limit). Dotted horizontal: the face layer
        (high-frequency limit). Dotted vertical: where the standard depth equals the face
        layer&apos;s thickness. The axis spans every curve and every limit line.
      </p>
      <FiguresTable
        summary="The figures plotted, as a table"
        caption={`${title} in ${label}, at the decades of the sweep, and the limits`}
        corner="Frequency"
        columns={results.map((r) => r.name)}
        rows={[
          ...samples.map((i) => ({
            key: i,
            label: formatHertz(frequencies[i]!),
            cells: results.map((r) =>
              formatConductivity(r.points[i]!.apparentConductivitySPerM, unit),
            ),
          })),
          {
            key: 'low',
            label: 'Low-frequency limit (thickness-weighted mean)',
            cells: results.map((r) =>
              r.limits.thicknessWeightedMeanSPerM !== null
                ? formatConductivity(r.limits.thicknessWeightedMeanSPerM, unit)
                : '—',
            ),
          },
          {
            key: 'high',
            label: 'High-frequency limit (face layer)',
            cells: results.map((r) => formatConductivity(r.limits.surfaceLayerSPerM, unit)),
          },
        ]}
      />
    </figure>
  );
}

/** The normalised impedance plane: ΔR/X0 across, X/X0 up, each blank traced over the sweep. */
export function ImpedancePlaneChart({ results }: { results: BlankResult[] }) {
  const frequencies = results[0]?.points.map((p) => p.frequencyHz) ?? [];
  const samples = samplePoints(results);
  return (
    <figure
      className="rounded-md border border-patina-100 bg-white p-3"
      aria-labelledby="impedance-chart-title"
    >
      <figcaption id="impedance-chart-title" className="mb-2 text-sm font-semibold">
        Normalised impedance plane (ratios, no unit)
      </figcaption>
      <div
        role="img"
        aria-label={`Chart of normalised reactance X/X0 against normalised resistance ΔR/X0 over the sweep for ${results.map((r) => r.name).join(' and ')}; the table below the chart lists the figures`}
        className="h-80"
      >
        <ResponsiveContainer width="100%" height="100%">
          <LineChart accessibilityLayer={false} margin={{ top: 8, right: 16, bottom: 20, left: 8 }}>
            <CartesianGrid stroke="#d5ebe6" />
            <XAxis
              dataKey="x"
              type="number"
              domain={[0, 'auto']}
              tickFormatter={tickNumber}
              label={{ value: 'ΔR / X0', position: 'insideBottom', offset: -12 }}
            />
            <YAxis
              dataKey="y"
              type="number"
              domain={['auto', 'auto']}
              tickFormatter={tickNumber}
              label={{ value: 'X / X0', angle: -90, position: 'insideLeft' }}
            />
            <Tooltip formatter={(v) => formatNumber(Number(v), 4)} />
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
      <FiguresTable
        summary="The figures plotted, as a table"
        caption="Normalised resistance and reactance (ΔR/X0, X/X0) at the decades of the sweep"
        corner="Frequency"
        columns={results.map((r) => `${r.name}: ΔR/X0, X/X0`)}
        rows={samples.map((i) => ({
          key: i,
          label: formatHertz(frequencies[i]!),
          cells: results.map(
            (r) =>
              `${formatNumber(r.points[i]!.normalizedResistance)}, ${formatNumber(r.points[i]!.normalizedReactance)}`,
          ),
        }))}
      />
    </figure>
  );
}
