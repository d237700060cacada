import { unitLabel } from '../../../../shared/units/codes';
import { fromKilogramsPerCubicMetre } from '../../../../shared/units/density';
import { seriesColours } from '../../../lib/chart-format';
import {
  conductivityIn,
  conductivityQuantityName,
  formatNumber,
  formatTick,
} from '../../../lib/format';
import type { MatchResult } from '../../../lib/api-types';
import { useUnitPreferences } from '../../../lib/unit-preferences';

/** The plot's frame in SVG units; it scales to the width it is given. */
const W = 560;
const H = 300;
const LEFT = 64;
const RIGHT = 12;
const TOP = 10;
const BOTTOM = 42;

/** Relative uncertainty the score assumes for a density figure (shared/match/score.ts), percent. */
const DENSITY_UNCERTAINTY_PERCENT = 1;
/** Candidates drawn: one per series colour; beyond the first few the boxes only hide each other. */
const DRAWN = 4;

const sorted = (a: number, b: number): [number, number] => (a <= b ? [a, b] : [b, a]);

/** The span of the values with a margin of `pad` of their width on each side. */
function spanOf(values: number[], pad = 0.15): [number, number] {
  const lo = Math.min(...values);
  const hi = Math.max(...values);
  const margin = (hi - lo || Math.abs(hi) || 1) * pad;
  return [lo - margin, hi + margin];
}

/**
 * Round ticks (steps of 1, 2, 2.5 or 5 × 10ⁿ) that cover [lo, hi]; the axis spans exactly them,
 * so a narrow cluster of ranges fills the plot.
 */
function roundTicks([lo, hi]: [number, number]): number[] {
  const raw = (hi - lo) / 4 || Math.abs(hi) / 4 || 1;
  const power = 10 ** Math.floor(Math.log10(raw));
  const step = [1, 2, 2.5, 5, 10].map((m) => m * power).find((s) => s >= raw)!;
  const ticks: number[] = [];
  for (let t = Math.floor(lo / step) * step; t <= hi + step * 1e-9; t += step)
    ticks.push(Number(t.toPrecision(12)));
  if (ticks.at(-1)! < hi) ticks.push(Number((ticks.at(-1)! + step).toPrecision(12)));
  return ticks;
}

/**
 * The reading among its candidates on conductivity (or resistivity) against density, drawn as
 * plain SVG (the axes span exactly the round ticks chosen here): each
 * candidate's handbook ranges as a box with its nominal as a dot, the reading as a copper box of
 * its uncertainty. Without a density the reading is a band across the plot.
 */
export function MatchPlot({ result }: { result: MatchResult }) {
  const [units] = useUnitPreferences();
  const cUnit = units.conductivity;
  const dUnit = units.density;
  const c = (sPerM: number) => conductivityIn(sPerM, cUnit);
  const d = (kgPerM3: number) => fromKilogramsPerCubicMetre(kgPerM3, dUnit);
  const candidates = result.candidates.filter((k) => k.densityRangeKgPerM3).slice(0, DRAWN);
  if (!candidates.length) return null;

  const reading = result.reading;
  const u = reading.uncertaintyPercent / 100;
  // The reading as first corrected for the best candidate (its own temperature coefficient).
  const readingSPerM = candidates[0]!.correctedConductivitySPerM;
  const readingC = sorted(c(readingSPerM * (1 - u)), c(readingSPerM * (1 + u)));
  const readingD = reading.densityKgPerM3
    ? sorted(
        d(reading.densityKgPerM3 * (1 - DENSITY_UNCERTAINTY_PERCENT / 100)),
        d(reading.densityKgPerM3 * (1 + DENSITY_UNCERTAINTY_PERCENT / 100)),
      )
    : null;

  const boxes = candidates.map((k, i) => {
    const cr = k.conductivityRangeSPerM;
    const dr = k.densityRangeKgPerM3!;
    return {
      key: k.slug,
      name: k.name,
      colour: seriesColours[i % seriesColours.length]!,
      x: sorted(d(dr.min), d(dr.max)),
      y: sorted(c(cr.min), c(cr.max)),
      point: { x: d(dr.nominal), y: c(cr.nominal), name: k.name },
    };
  });
  const xDomain = spanOf([...boxes.flatMap((b) => b.x), ...(readingD ?? [])]);
  const yDomain = spanOf([...boxes.flatMap((b) => b.y), ...readingC]);
  const xTicks = roundTicks(xDomain);
  const yTicks = roundTicks(yDomain);
  const [x0, x1] = [xTicks[0]!, xTicks.at(-1)!];
  const [y0, y1] = [yTicks[0]!, yTicks.at(-1)!];
  const px = (x: number) => LEFT + ((x - x0) / (x1 - x0)) * (W - LEFT - RIGHT);
  const py = (y: number) => H - BOTTOM - ((y - y0) / (y1 - y0)) * (H - TOP - BOTTOM);
  const quantity = conductivityQuantityName(cUnit);
  const summary =
    `The reading, ${formatNumber(c(readingSPerM))} ${unitLabel(cUnit)}` +
    (reading.densityKgPerM3
      ? ` and ${formatNumber(d(reading.densityKgPerM3))} ${unitLabel(dUnit)}`
      : ' (no density given: drawn as a band)') +
    `, among the handbook ranges of ${boxes.map((b) => b.name).join(', ')}.`;

  return (
    <figure className="flex flex-col gap-2 rounded-md border border-patina-100 bg-white p-3">
      <figcaption className="text-sm">
        <span className="font-medium">Where the reading sits.</span> Each box is an alloy&apos;s
        handbook range of {quantity.toLowerCase()} and density, its dot the nominal; the copper box
        is the reading with its uncertainty.
      </figcaption>
      <svg
        role="img"
        aria-label={summary}
        viewBox={`0 0 ${W} ${H}`}
        className="h-auto w-full max-w-2xl"
      >
        {xTicks.map((t) => (
          <g key={`x${t}`}>
            <line x1={px(t)} x2={px(t)} y1={TOP} y2={H - BOTTOM} stroke="#d5ebe6" />
            <text x={px(t)} y={H - BOTTOM + 16} textAnchor="middle" fontSize="11" fill="#1d2421">
              {formatTick(t)}
            </text>
          </g>
        ))}
        {yTicks.map((t) => (
          <g key={`y${t}`}>
            <line x1={LEFT} x2={W - RIGHT} y1={py(t)} y2={py(t)} stroke="#d5ebe6" />
            <text x={LEFT - 6} y={py(t) + 4} textAnchor="end" fontSize="11" fill="#1d2421">
              {formatTick(t)}
            </text>
          </g>
        ))}
        <rect
          x={LEFT}
          y={TOP}
          width={W - LEFT - RIGHT}
          height={H - TOP - BOTTOM}
          fill="none"
          stroke="#8cc5b8"
        />
        {boxes.map((b) => (
          <g key={b.key}>
            <rect
              x={px(b.x[0])}
              y={py(b.y[1])}
              width={Math.max(2, px(b.x[1]) - px(b.x[0]))}
              height={Math.max(2, py(b.y[0]) - py(b.y[1]))}
              fill={b.colour}
              fillOpacity={0.12}
              stroke={b.colour}
            >
              <title>{b.name}</title>
            </rect>
            <circle cx={px(b.point.x)} cy={py(b.point.y)} r={4} fill={b.colour} />
          </g>
        ))}
        <rect
          x={readingD ? px(readingD[0]) : LEFT}
          y={py(readingC[1])}
          width={readingD ? Math.max(3, px(readingD[1]) - px(readingD[0])) : W - LEFT - RIGHT}
          height={Math.max(3, py(readingC[0]) - py(readingC[1]))}
          fill="#e3a677"
          fillOpacity={0.45}
          stroke="#8a4519"
          strokeWidth={2}
        >
          <title>the reading ± its uncertainty</title>
        </rect>
        <text x={(LEFT + W - RIGHT) / 2} y={H - 6} textAnchor="middle" fontSize="12" fill="#1d2421">
          Density ({unitLabel(dUnit)})
        </text>
        <text
          transform={`translate(14 ${(TOP + H - BOTTOM) / 2}) rotate(-90)`}
          textAnchor="middle"
          fontSize="12"
          fill="#1d2421"
        >
          {quantity} ({unitLabel(cUnit)})
        </text>
      </svg>
      <ul className="flex flex-wrap gap-x-4 gap-y-1 text-xs">
        {boxes.map((b) => (
          <li key={b.key} className="flex items-center gap-1.5">
            <span
              aria-hidden="true"
              className="inline-block h-3 w-3 rounded-sm border"
              style={{ background: `${b.colour}33`, borderColor: b.colour }}
            />
            {b.name}
          </li>
        ))}
        <li className="flex items-center gap-1.5">
          <span
            aria-hidden="true"
            className="inline-block h-3 w-3 rounded-sm border-2 border-copper-700 bg-copper-300"
          />
          the reading ± its uncertainty
        </li>
      </ul>
    </figure>
  );
}
