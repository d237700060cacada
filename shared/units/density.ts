import { canonicalUnit, densityUnits, type DensityUnit } from './codes';
import { InvalidQuantityError, UnknownUnitError } from './errors';

/**
 * Density factors to kg/m³. convert-units has no density and rounds the pound (0.453592 kg),
 * so these are ours: 1 lb = 0.45359237 kg and 1 in = 0.0254 m exactly (NIST SP 811, appendix B),
 * giving 1 lb/in³ = 27 679.904 710 2 kg/m³.
 */
const kgPerM3: Record<DensityUnit, number> = {
  'kg/m3': 1,
  'g/cm3': 1000,
  'lb/in3': 0.45359237 / 0.0254 ** 3,
};

/**
 * Density in kg/m³.
 * @example toKilogramsPerCubicMetre(8.53, 'g/cm3') // 8530
 */
export function toKilogramsPerCubicMetre(value: number, unit: string): number {
  const code = canonicalUnit(unit);
  if (!Number.isFinite(value) || value <= 0)
    throw new InvalidQuantityError('density must be a finite number greater than zero');
  if (!(code in kgPerM3)) throw new UnknownUnitError(unit, densityUnits);
  return value * kgPerM3[code as DensityUnit];
}

export function fromKilogramsPerCubicMetre(value: number, unit: string): number {
  const code = canonicalUnit(unit);
  if (!(code in kgPerM3)) throw new UnknownUnitError(unit, densityUnits);
  return value / kgPerM3[code as DensityUnit];
}
