import {
  fromSiemensPerMetre,
  IACS_100_S_PER_M,
  isResistivityUnit,
  toSiemensPerMetre,
} from '../../../shared/units/conductivity';
import { unitLabel } from '../../../shared/units/codes';
import {
  formatConductivity,
  formatConductivityRange,
  formatDensity,
  formatNumber,
} from '../../lib/format';
import type { UnitPreferences } from '../../lib/unit-preferences';

const NUMBER = String.raw`(\d+(?:\.\d+)?(?:e[+-]?\d+)?)`;
const perIacs = IACS_100_S_PER_M / 100;

const n = (text: string) => Number(text) * perIacs;

/**
 * The service writes its reasons in the trade's everyday units (%IACS, g/cm³; shared/match);
 * this rewrites their figures in the units the person chose. A reading outside a range is
 * restated whole, so that under a resistivity choice "above" and "below" and the gap are those
 * of the resistivity (a higher conductivity is a lower resistivity).
 */
export function reasonInUnits(reason: string, units: UnitPreferences): string {
  const c = units.conductivity;
  const d = units.density;
  const outside = new RegExp(
    `^${NUMBER} %IACS at (.+?) lies ${NUMBER} %IACS (below|above) ${NUMBER}–${NUMBER} %IACS$`,
  );
  const m = outside.exec(reason);
  if (m) {
    const [, sigma, at, gap, side, lo, hi] = m as unknown as string[];
    const reading = formatConductivity(n(sigma!), c);
    const range = formatConductivityRange(n(lo!), n(hi!), c);
    if (!isResistivityUnit(c))
      return `${reading} at ${at} lies ${formatNumber(n(gap!) / toSiemensPerMetre(1, c))} ${unitLabel(c)} ${side} ${range}`;
    const rho = (x: string) => fromSiemensPerMetre(n(x), c);
    const distance = Math.min(Math.abs(rho(sigma!) - rho(lo!)), Math.abs(rho(sigma!) - rho(hi!)));
    return `${reading} at ${at} lies ${formatNumber(distance)} ${unitLabel(c)} ${side === 'below' ? 'above' : 'below'} ${range}`;
  }
  return reason
    .replace(new RegExp(`${NUMBER}–${NUMBER} %IACS`, 'g'), (_, a: string, b: string) =>
      formatConductivityRange(n(a), n(b), c),
    )
    .replace(new RegExp(`${NUMBER} %IACS`, 'g'), (_, v: string) => formatConductivity(n(v), c))
    .replace(new RegExp(`${NUMBER}–${NUMBER} g/cm³`, 'g'), (_, a: string, b: string) => {
      const [lo, hi] = [formatDensity(Number(a) * 1000, d), formatDensity(Number(b) * 1000, d)];
      return `${lo.split(' ')[0]}–${hi}`;
    })
    .replace(new RegExp(`${NUMBER} g/cm³`, 'g'), (_, v: string) =>
      formatDensity(Number(v) * 1000, d),
    )
    .replace(
      new RegExp(`α = ${NUMBER} /K`, 'g'),
      (_, v: string) => `α = ${formatNumber(Number(v))} /K`,
    );
}
