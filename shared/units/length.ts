import convert from 'convert-units';
import { canonicalUnit, lengthUnits } from './codes';
import { InvalidQuantityError, UnknownUnitError } from './errors';

/**
 * Exact factors where convert-units is not exact enough: its inch is 25.3999992 mm, 3e-8 off.
 * NIST SP 811 (2008), appendix B: 1 in = 0.0254 m exactly; 1 mil = 0.001 in = 25.4 µm exactly.
 * convert-units has no micrometre at all.
 */
const exactMetres: Readonly<Record<string, number>> = { in: 0.0254, mil: 0.0000254, um: 1e-6 };

/**
 * Length in metres.
 * @example toMetres(1, 'mil') // 2.54e-5
 */
export function toMetres(value: number, unit: string): number {
  const code = canonicalUnit(unit);
  if (!Number.isFinite(value)) throw new InvalidQuantityError('length must be a finite number');
  const exact = exactMetres[code];
  if (exact !== undefined) return value * exact;
  if (code === 'm' || code === 'mm') return convert(value).from(code).to('m');
  throw new UnknownUnitError(unit, lengthUnits);
}

/** A length in metres expressed in another length unit. */
export function fromMetres(metres: number, unit: string): number {
  const code = canonicalUnit(unit);
  const exact = exactMetres[code];
  if (exact !== undefined) return metres / exact;
  if (code === 'm' || code === 'mm') return convert(metres).from('m').to(code);
  throw new UnknownUnitError(unit, lengthUnits);
}
