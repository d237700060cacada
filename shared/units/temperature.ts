import convert from 'convert-units';
import { canonicalUnit, temperatureUnits } from './codes';
import { InvalidQuantityError, UnknownUnitError } from './errors';

/** 20 °C, the reference temperature of the IACS and of most handbook conductivities. */
export const ROOM_TEMPERATURE_K = 293.15;

/**
 * Temperature in kelvin through convert-units (its offsets are exact: 273.15, 459.67).
 * @example toKelvin(20, 'C') // 293.15
 */
export function toKelvin(value: number, unit: string): number {
  const code = canonicalUnit(unit);
  if (!Number.isFinite(value))
    throw new InvalidQuantityError('temperature must be a finite number');
  if (!(temperatureUnits as readonly string[]).includes(code))
    throw new UnknownUnitError(unit, temperatureUnits);
  const kelvin =
    code === 'K'
      ? value
      : convert(value)
          .from(code as 'C' | 'F')
          .to('K');
  if (kelvin <= 0) throw new InvalidQuantityError('temperature must be above absolute zero');
  return kelvin;
}

/** A temperature in kelvin expressed in °C, K or °F. */
export function fromKelvin(kelvin: number, unit: string): number {
  const code = canonicalUnit(unit);
  if (!(temperatureUnits as readonly string[]).includes(code))
    throw new UnknownUnitError(unit, temperatureUnits);
  return code === 'K'
    ? kelvin
    : convert(kelvin)
        .from('K')
        .to(code as 'C' | 'F');
}
