/** Series colours for up to four compared blanks: ours, distinct in hue and in lightness. */
export const seriesColours = ['#1d5c51', '#b8642e', '#4a5a8a', '#8a7a1e'];

/** Decade ticks between two frequencies, for log axes. */
export function decadeTicks(min: number, max: number): number[] {
  const ticks: number[] = [];
  for (let e = Math.floor(Math.log10(min)); e <= Math.ceil(Math.log10(max)); e++) {
    const v = 10 ** e;
    if (v >= min * 0.999 && v <= max * 1.001) ticks.push(v);
  }
  return ticks;
}

export function formatHertz(hz: number): string {
  if (hz >= 1e6) return `${Number((hz / 1e6).toPrecision(3))} MHz`;
  if (hz >= 1e3) return `${Number((hz / 1e3).toPrecision(3))} kHz`;
  return `${Number(hz.toPrecision(3))} Hz`;
}

export function formatMetres(m: number): string {
  if (m >= 1) return `${Number(m.toPrecision(3))} m`;
  if (m >= 1e-3) return `${Number((m * 1e3).toPrecision(3))} mm`;
  return `${Number((m * 1e6).toPrecision(3))} µm`;
}
