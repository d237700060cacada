import {
  fromSiemensPerMetre,
  isResistivityUnit,
  toSiemensPerMetre,
} from '../../../shared/units/conductivity';
import {
  fromKilogramsPerCubicMetre,
  toKilogramsPerCubicMetre,
} from '../../../shared/units/density';
import type { CatalogueFilters } from './filters';

const tidy = (n: number) => String(Number(n.toPrecision(4)));

function convertText(text: string, to: (n: number) => number): string {
  const n = Number(text);
  return text.trim() !== '' && Number.isFinite(n) && n > 0 ? tidy(to(n)) : text;
}

/**
 * The range filters re-expressed in new display units, so switching units keeps the same
 * physical range. Going between a conductivity and a resistivity unit swaps the two ends.
 */
export function rangesInUnits(
  f: CatalogueFilters,
  conductivityUnit: string,
  densityUnit: string,
): Partial<CatalogueFilters> {
  const next: Partial<CatalogueFilters> = {};
  if (conductivityUnit !== f.cunit) {
    const convert = (text: string) =>
      convertText(text, (n) =>
        fromSiemensPerMetre(toSiemensPerMetre(n, f.cunit), conductivityUnit),
      );
    const swap = isResistivityUnit(conductivityUnit) !== isResistivityUnit(f.cunit);
    const [cmin, cmax] = [convert(f.cmin), convert(f.cmax)];
    Object.assign(next, swap ? { cmin: cmax, cmax: cmin } : { cmin, cmax }, {
      cunit: conductivityUnit,
    });
  }
  if (densityUnit !== f.dunit) {
    const convert = (text: string) =>
      convertText(text, (n) =>
        fromKilogramsPerCubicMetre(toKilogramsPerCubicMetre(n, f.dunit), densityUnit),
      );
    Object.assign(next, { dmin: convert(f.dmin), dmax: convert(f.dmax), dunit: densityUnit });
  }
  return next;
}
