import type { QuotedFigure, QuotedUnit } from './quoted-figure';

/** How each unit a source prints is written for people. */
const unitText: Record<QuotedUnit, string> = {
  '%IACS': '%IACS',
  'MS/m': 'MS/m',
  'uohm.cm': 'µΩ·cm',
  'nohm.m': 'nΩ·m',
  'ohm.cmil/ft': 'Ω·cmil/ft',
  'g/cm3': 'g/cm³',
  'kg/m3': 'kg/m³',
  'lb/in3': 'lb/in³',
  '1/K': '/K',
  '1/degF': '/°F',
  '1': '',
};

/**
 * One located figure as a plain line for the alloy sheet: where it stands in the document, the
 * figure as printed in the document's unit, and the temperature and temper the document states.
 * @example quotedLine({ where: 'Table 2', value: 28, unit: '%IACS', temperatureC: 20, temper: 'annealed', … })
 * // 'Table 2: 28 %IACS at 20 °C (annealed)'
 */
export function quotedLine(f: QuotedFigure): string {
  const unit = unitText[f.unit];
  // '/K' and '/°F' follow the figure directly (0.00393/K); the others after a space.
  const figure =
    unit === ''
      ? String(f.value)
      : unit.startsWith('/')
        ? `${f.value}${unit}`
        : `${f.value} ${unit}`;
  const at = f.temperatureC === undefined ? '' : ` at ${f.temperatureC} °C`;
  const temper = f.temper ? ` (${f.temper})` : '';
  return `${f.where}: ${figure}${at}${temper}`;
}

/**
 * The quote line of one value of the table: every figure its own source prints for it (one in
 * the usual case, several when the source gives the value for more than one temper), or null
 * when the value cites no located document.
 */
export function quotedLineFor(
  figures: readonly QuotedFigure[],
  slug: string,
  quantity: string,
  sourceId: number,
): string | null {
  const lines = figures
    .filter((f) => f.slug === slug && f.quantity === quantity && f.sourceId === sourceId)
    .map(quotedLine);
  return lines.length ? lines.join('; ') : null;
}
