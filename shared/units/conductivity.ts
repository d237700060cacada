import {
  canonicalUnit,
  conductivityUnits,
  resistivityUnits,
  type ConductivityUnit,
  type ResistivityUnit,
} from './codes';
import { InvalidQuantityError, UnknownUnitError } from './errors';

/**
 * 100 %IACS: the conductivity of the International Annealed Copper Standard at 20 °C,
 * 58.0 MS/m, i.e. a resistivity of 1/58 Ω·mm²/m = 1.7241 µΩ·cm (IEC 60028; ASTM E1004 restates
 * it as 0.58×10⁸ S/m). convert-units has no electrical conductivity, so these factors are ours.
 */
export const IACS_100_S_PER_M = 58.0e6;

const conductivityFactors: Record<ConductivityUnit, number> = {
  'S/m': 1,
  'MS/m': 1e6,
  '%IACS': IACS_100_S_PER_M / 100,
};

const resistivityFactors: Record<ResistivityUnit, number> = {
  ohm_m: 1,
  uohm_cm: 1e-8,
  nohm_m: 1e-9,
};

export type ElectricalUnit = ConductivityUnit | ResistivityUnit;
export const electricalUnits: readonly ElectricalUnit[] = [
  ...conductivityUnits,
  ...resistivityUnits,
];

function requirePositiveFinite(value: number, what: string): void {
  if (!Number.isFinite(value)) throw new InvalidQuantityError(`${what} must be a finite number`);
  if (value <= 0) throw new InvalidQuantityError(`${what} must be greater than zero`);
}

/** True when the code (or alias) names a resistivity unit rather than a conductivity one. */
export function isResistivityUnit(unit: string): boolean {
  return (resistivityUnits as readonly string[]).includes(canonicalUnit(unit));
}

/**
 * Conductivity in S/m from a value in any conductivity or resistivity unit.
 * @example toSiemensPerMetre(28, '%IACS') // 16.24e6
 * @example toSiemensPerMetre(1.7241, 'uohm_cm') // ≈ 58.0e6
 */
export function toSiemensPerMetre(value: number, unit: string): number {
  const code = canonicalUnit(unit);
  requirePositiveFinite(value, 'conductivity');
  if (code in conductivityFactors) return value * conductivityFactors[code as ConductivityUnit];
  if (code in resistivityFactors) return 1 / (value * resistivityFactors[code as ResistivityUnit]);
  throw new UnknownUnitError(unit, electricalUnits);
}

/**
 * A conductivity in S/m expressed in any conductivity or resistivity unit.
 * @example fromSiemensPerMetre(58e6, 'uohm_cm') // ≈ 1.7241
 */
export function fromSiemensPerMetre(sPerM: number, unit: string): number {
  const code = canonicalUnit(unit);
  requirePositiveFinite(sPerM, 'conductivity');
  if (code in conductivityFactors) return sPerM / conductivityFactors[code as ConductivityUnit];
  if (code in resistivityFactors) return 1 / (sPerM * resistivityFactors[code as ResistivityUnit]);
  throw new UnknownUnitError(unit, electricalUnits);
}

/** %IACS of a conductivity in S/m. */
export function percentIacs(sPerM: number): number {
  return (sPerM / IACS_100_S_PER_M) * 100;
}
