import {
  CartesianGrid,
  ReferenceArea,
  ResponsiveContainer,
  Scatter,
  ScatterChart,
  Tooltip,
  XAxis,
  YAxis,
} from 'recharts';
import { unitLabel } from '../../../../shared/units/codes';
import { FiguresTable } from '../../../components/figures-table';
import { niceLinearAxis, tickNumber } from '../../../lib/chart-format';
import { formatConductivityRange, formatFrequency, formatNumber } from '../../../lib/format';
import type { UnitPreferences } from '../../../lib/unit-preferences';
import type { PlanResult } from '../api/evaluate-plan';
import { planColours } from './plan-colours';
import { endsIn } from './window-chart';

interface Box {
  name: string;
  x: [number, number];
  y: [number, number];
}

/** Boxes on a plane: one rectangle per product, with its name in a legend of coloured text. */
function BoxChart({
  id,
  title,
  description,
  xLabel,
  yLabel,
  boxes,
}: {
  id: string;
  title: string;
  description: string;
  xLabel: string;
  yLabel: string;
  boxes: Box[];
}) {
  const xAxis = niceLinearAxis(boxes.flatMap((b) => b.x));
  const yAxis = niceLinearAxis(boxes.flatMap((b) => b.y));
  const xDomain = xAxis.domain;
  const yDomain = yAxis.domain;
  // A box of no width would vanish: give it a hair of the axis.
  const grow = ([a, b]: [number, number], [lo, hi]: [number, number]): [number, number] =>
    b - a > (hi - lo) * 0.004 ? [a, b] : [a - (hi - lo) * 0.002, b + (hi - lo) * 0.002];
  const centres = boxes.map((b) => ({
    name: b.name,
    x: (b.x[0] + b.x[1]) / 2,
    y: (b.y[0] + b.y[1]) / 2,
  }));
  return (
    <figure
      className="rounded-md border border-patina-100 bg-white p-3"
      aria-labelledby={`${id}-title`}
    >
      <figcaption id={`${id}-title`} className="mb-2 text-sm font-semibold">
        {title}
      </figcaption>
      <ul className="mb-2 flex flex-wrap gap-x-3 text-xs" aria-label="Products">
        {boxes.map((b, i) => (
          <li
            key={b.name}
            style={{ color: planColours[i % planColours.length] }}
            className="font-medium"
          >
            ■ {b.name}
          </li>
        ))}
      </ul>
      <div
        role="img"
        aria-label={`${description}; the table below the chart lists the figures`}
        className="h-72"
      >
        <ResponsiveContainer width="100%" height="100%">
          <ScatterChart
            accessibilityLayer={false}
            margin={{ top: 8, right: 16, bottom: 24, left: 16 }}
          >
            <CartesianGrid stroke="#d5ebe6" />
            <XAxis
              type="number"
              dataKey="x"
              domain={xDomain}
              ticks={xAxis.ticks}
              tickFormatter={tickNumber}
              label={{ value: xLabel, position: 'insideBottom', offset: -14 }}
            />
            <YAxis
              type="number"
              dataKey="y"
              domain={yDomain}
              ticks={yAxis.ticks}
              tickFormatter={tickNumber}
              label={{ value: yLabel, angle: -90, position: 'insideLeft', offset: -8 }}
            />
            <Tooltip formatter={(v) => formatNumber(Number(v))} />
            {boxes.map((b, i) => {
              const [x1, x2] = grow(b.x, xDomain);
              const [y1, y2] = grow(b.y, yDomain);
              return (
                <ReferenceArea
                  key={b.name}
                  x1={x1}
                  x2={x2}
                  y1={y1}
                  y2={y2}
                  fill={planColours[i % planColours.length]}
                  fillOpacity={0.3}
                  stroke={planColours[i % planColours.length]}
                  ifOverflow="extendDomain"
                />
              );
            })}
            <Scatter data={centres} fill="#1f2a28" isAnimationActive={false} name="centres" />
          </ScatterChart>
        </ResponsiveContainer>
      </div>
    </figure>
  );
}

/** Each product's region of the normalised impedance plane at one frequency. */
export function ImpedanceRegions({
  result,
  frequencyIndex,
}: {
  result: PlanResult;
  frequencyIndex: number;
}) {
  const f = result.frequencies[frequencyIndex];
  if (!f) return null;
  const boxes = f.windows.map((w) => ({
    name: w.product,
    x: w.impedance.resistance as [number, number],
    y: w.impedance.reactance as [number, number],
  }));
  return (
    <div>
      <BoxChart
        id="impedance-regions"
        title={`Impedance plane at ${formatFrequency(f.frequencyHz)}: each product's region (normalised to the coil in air)`}
        description={`Chart of each product's region of the normalised impedance plane at ${formatFrequency(f.frequencyHz)}, resistance ΔR/X0 across, reactance X/X0 up`}
        xLabel="ΔR/X0"
        yLabel="X/X0"
        boxes={boxes}
      />
      <FiguresTable
        summary="The figures of this chart"
        caption={`Normalised impedance region of each product at ${formatFrequency(f.frequencyHz)}`}
        corner="Product"
        columns={['ΔR/X0', 'X/X0']}
        rows={boxes.map((b) => ({
          key: b.name,
          label: b.name,
          cells: [
            `${formatNumber(b.x[0], 4)}–${formatNumber(b.x[1], 4)}`,
            `${formatNumber(b.y[0], 4)}–${formatNumber(b.y[1], 4)}`,
          ],
        }))}
      />
    </div>
  );
}

/** The recommended pair of frequencies: each product as a box of its two windows. */
export function PairChart({ result, units }: { result: PlanResult; units: UnitPreferences }) {
  const pair = result.recommendedPair;
  if (!pair) return null;
  const [a, b] = pair.map((hz) => result.frequencies.find((f) => f.frequencyHz === hz)!);
  const unit = units.conductivity;
  const label = unitLabel(unit);
  const boxes = a!.windows.map((w, i) => ({
    name: w.product,
    x: endsIn(w.lowSPerM, w.highSPerM, unit),
    y: endsIn(b!.windows[i]!.lowSPerM, b!.windows[i]!.highSPerM, unit),
  }));
  return (
    <div>
      <BoxChart
        id="pair-chart"
        title={`Recommended pair: reading at ${formatFrequency(a!.frequencyHz)} against reading at ${formatFrequency(b!.frequencyHz)} (${label})`}
        description={`Chart of each product's window at ${formatFrequency(a!.frequencyHz)} across and at ${formatFrequency(b!.frequencyHz)} up, in ${label}, as boxes`}
        xLabel={`at ${formatFrequency(a!.frequencyHz)}, ${label}`}
        yLabel={`at ${formatFrequency(b!.frequencyHz)}`}
        boxes={boxes}
      />
      <FiguresTable
        summary="The figures of this chart"
        caption="Each product's windows at the recommended pair of frequencies"
        corner="Product"
        columns={[formatFrequency(a!.frequencyHz), formatFrequency(b!.frequencyHz)]}
        rows={a!.windows.map((w, i) => ({
          key: w.product,
          label: w.product,
          cells: [
            formatConductivityRange(w.lowSPerM, w.highSPerM, unit),
            formatConductivityRange(b!.windows[i]!.lowSPerM, b!.windows[i]!.highSPerM, unit),
          ],
        }))}
      />
    </div>
  );
}
