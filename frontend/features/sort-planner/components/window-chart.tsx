import {
  Area,
  CartesianGrid,
  ComposedChart,
  Legend,
  ReferenceArea,
  ReferenceLine,
  ResponsiveContainer,
  Tooltip,
  XAxis,
  YAxis,
} from 'recharts';
import { unitLabel } from '../../../../shared/units/codes';
import { FiguresTable } from '../../../components/figures-table';
import { decadeTicks, formatHertz, tickNumber } from '../../../lib/chart-format';
import {
  conductivityIn,
  conductivityQuantityName,
  formatConductivityRange,
  formatFrequency,
  formatNumber,
} from '../../../lib/format';
import type { UnitPreferences } from '../../../lib/unit-preferences';
import type { PlanResult } from '../api/evaluate-plan';
import { planColours } from './plan-colours';

/** The window's ends in the chosen unit, low first (a resistivity unit swaps them). */
export function endsIn(lo: number, hi: number, unit: string): [number, number] {
  const a = conductivityIn(lo, unit);
  const b = conductivityIn(hi, unit);
  return a <= b ? [a, b] : [b, a];
}

/**
 * Each product's window of readings against frequency, as a band on a log axis; frequencies where
 * two windows overlap shaded; the recommended frequency marked.
 */
export function WindowChart({ result, units }: { result: PlanResult; units: UnitPreferences }) {
  const unit = units.conductivity;
  const label = unitLabel(unit);
  const quantity = `apparent ${conductivityQuantityName(unit).toLowerCase()}`;
  const products = result.frequencies[0]?.windows.map((w) => w.product) ?? [];
  const freqs = result.frequencies.map((f) => f.frequencyHz);
  const rows = result.frequencies.map((f) => {
    const row: Record<string, number | [number, number]> = { f: f.frequencyHz };
    f.windows.forEach((w, i) => (row[`p${i}`] = endsIn(w.lowSPerM, w.highSPerM, unit)));
    return row;
  });
  // Shade from halfway (on the log axis) to each neighbour around a frequency with an overlap.
  const mid = (a: number, b: number) => Math.sqrt(a * b);
  const shaded = result.frequencies.flatMap((f, i) =>
    f.overlaps.length
      ? [
          {
            x1: i > 0 ? mid(freqs[i - 1]!, f.frequencyHz) : f.frequencyHz,
            x2: i < freqs.length - 1 ? mid(f.frequencyHz, freqs[i + 1]!) : f.frequencyHz,
          },
        ]
      : [],
  );
  // A log axis: windows from a few to a few hundred %IACS all stay readable.
  const ends = result.frequencies.flatMap((f) =>
    f.windows.flatMap((w) => endsIn(w.lowSPerM, w.highSPerM, unit)),
  );
  const domain: [number, number] = [Math.min(...ends) / 1.2, Math.max(...ends) * 1.2];
  const yTicks: number[] = [];
  for (let e = Math.floor(Math.log10(domain[0])); e <= Math.ceil(Math.log10(domain[1])); e++)
    for (const m of [1, 2, 5]) {
      const t = m * 10 ** e;
      if (t >= domain[0] && t <= domain[1]) yTicks.push(Number(t.toPrecision(6)));
    }
  return (
    <figure
      className="rounded-md border border-patina-100 bg-white p-3"
      aria-labelledby="window-chart-title"
    >
      <figcaption id="window-chart-title" className="mb-2 text-sm font-semibold">
        Window of each product&apos;s reading against frequency ({label}, log scale); overlaps
        shaded
      </figcaption>
      <div
        role="img"
        aria-label={`Chart of each product's window of ${quantity} in ${label} against frequency, frequencies with overlapping windows shaded${result.recommendedFrequencyHz ? `, the recommended ${formatFrequency(result.recommendedFrequencyHz)} marked` : ''}; the table below the chart lists the figures`}
        className="h-80"
      >
        <ResponsiveContainer width="100%" height="100%">
          <ComposedChart
            accessibilityLayer={false}
            data={rows}
            margin={{ top: 24, right: 16, bottom: 20, left: 16 }}
          >
            <CartesianGrid stroke="#d5ebe6" />
            <XAxis
              dataKey="f"
              type="number"
              scale="log"
              domain={['dataMin', 'dataMax']}
              ticks={decadeTicks(freqs[0] ?? 1, freqs.at(-1) ?? 10)}
              tickFormatter={formatHertz}
              label={{ value: 'frequency', position: 'insideBottom', offset: -12 }}
            />
            <YAxis
              scale="log"
              domain={domain}
              ticks={yTicks}
              allowDataOverflow
              tickFormatter={tickNumber}
              label={{ value: label, angle: -90, position: 'insideLeft', offset: -8 }}
            />
            <Tooltip
              labelFormatter={(f) => formatHertz(Number(f))}
              formatter={(v) =>
                Array.isArray(v)
                  ? `${formatNumber(Number(v[0]))}–${formatNumber(Number(v[1]))} ${label}`
                  : String(v)
              }
            />
            {/* In the order the products were listed, as the other charts and tables give them. */}
            <Legend verticalAlign="top" itemSorter={null} />
            {shaded.map((s, i) => (
              <ReferenceArea
                key={`o${i}`}
                x1={s.x1}
                x2={s.x2}
                fill="#b9a27a"
                fillOpacity={0.25}
                stroke="none"
                ifOverflow="hidden"
              />
            ))}
            {products.map((p, i) => (
              <Area
                key={p}
                dataKey={`p${i}`}
                name={p}
                stroke={planColours[i % planColours.length]}
                fill={planColours[i % planColours.length]}
                fillOpacity={0.25}
                isAnimationActive={false}
              />
            ))}
            {result.recommendedFrequencyHz ? (
              <ReferenceLine
                x={result.recommendedFrequencyHz}
                stroke="#1f2a28"
                strokeDasharray="5 3"
                label={{ value: 'recommended', position: 'insideTopRight' }}
              />
            ) : null}
          </ComposedChart>
        </ResponsiveContainer>
      </div>
      <FiguresTable
        summary="The figures of this chart"
        caption={`Each product's window of ${quantity} in ${label} by frequency`}
        corner="Frequency"
        columns={products}
        rows={result.frequencies.map((f) => ({
          key: f.frequencyHz,
          label: `${formatFrequency(f.frequencyHz)}${f.overlaps.length ? ' (overlap)' : ''}`,
          cells: f.windows.map((w) => formatConductivityRange(w.lowSPerM, w.highSPerM, unit)),
        }))}
      />
    </figure>
  );
}
