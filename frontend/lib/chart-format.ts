import { formatFrequency, formatLength, formatTick } from './format';

/**
 * Series colours for up to four compared blanks: ours, distinct in hue and in lightness, and
 * dark enough (5:1 or more on white) to colour the blanks' names as text.
 */
export const seriesColours = ['#1d5c51', '#a15424', '#4a5a8a', '#766818'];

/** Decade ticks between two frequencies, for log axes. */
export function decadeTicks(min: number, max: number): number[] {
  const ticks: number[] = [];
  for (let e = Math.floor(Math.log10(min)); e <= Math.ceil(Math.log10(max)); e++) {
    const v = 10 ** e;
    if (v >= min * 0.999 && v <= max * 1.001) ticks.push(v);
  }
  return ticks;
}

/** Tick and tooltip text for charts: the number style of format.ts. */
export const formatHertz = formatFrequency;
export const formatMetres = formatLength;
export const tickNumber = (v: unknown) => formatTick(Number(v));

/** The smallest round number (1, 1.2, 1.5, 2, 2.5, 3, 4, 5, 6, 8 × 10ⁿ) at or above x > 0. */
function niceAbove(x: number): number {
  const step = 10 ** Math.floor(Math.log10(x));
  for (const m of [1, 1.2, 1.5, 2, 2.5, 3, 4, 5, 6, 8, 10])
    if (m * step >= x * (1 - 1e-12)) return m * step;
  return 10 * step;
}

/**
 * An axis domain that holds the data and every reference line drawn on it, with a little room
 * and round ends; a line outside the domain would be clipped or drawn off the plot.
 */
export function domainIncluding(
  values: number[],
  { floorZero = false, pad = 0.04 }: { floorZero?: boolean; pad?: number } = {},
): [number, number] {
  const finite = values.filter((v) => Number.isFinite(v));
  if (!finite.length) return [0, 1];
  let lo = Math.min(...finite);
  let hi = Math.max(...finite);
  const span = hi - lo || Math.abs(hi) || 1;
  lo = floorZero ? Math.min(0, lo) : lo - span * pad;
  hi = hi + span * pad;
  return [lo, hi > 0 ? niceAbove(hi) : hi];
}

/**
 * A linear axis with round ends and round ticks (about `count` of them, steps of 1, 2, 2.5 or 5 ×
 * 10ⁿ) that holds every value: the Sort Planner's planes read 0.03, 0.06, 0.09, not 0.0291, 0.0641.
 */
export function niceLinearAxis(
  values: number[],
  count = 5,
): { domain: [number, number]; ticks: number[] } {
  const finite = values.filter((v) => Number.isFinite(v));
  if (!finite.length) return { domain: [0, 1], ticks: [0, 0.5, 1] };
  let lo = Math.min(...finite);
  let hi = Math.max(...finite);
  if (hi === lo) {
    const half = Math.abs(hi) * 0.05 || 0.5;
    lo -= half;
    hi += half;
  }
  const rough = (hi - lo) / count;
  const power = 10 ** Math.floor(Math.log10(rough));
  const step = ([1, 2, 2.5, 5, 10].find((m) => m * power >= rough) ?? 10) * power;
  const start = Math.floor(lo / step) * step;
  const end = Math.ceil(hi / step) * step;
  const ticks: number[] = [];
  for (let t = start; t <= end + step * 1e-9; t += step) ticks.push(Number(t.toPrecision(12)));
  return { domain: [ticks[0]!, ticks.at(-1)!], ticks };
}
