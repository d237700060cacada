import convert from 'convert-units';
import { canonicalUnit, capacitanceUnits, resistanceUnits, voltageUnits } from './codes';
import { InvalidQuantityError, UnknownUnitError } from './errors';

function positive(value: number, what: string): void {
  if (!Number.isFinite(value) || value <= 0)
    throw new InvalidQuantityError(`${what} must be a finite number greater than zero`);
}

/** Capacitance in farads; convert-units has none, so the factor (µF = 1e-6 F) is ours. */
export function toFarads(value: number, unit: string): number {
  positive(value, 'capacitance');
  const code = canonicalUnit(unit);
  if (code === 'F') return value;
  if (code === 'uF') return value * 1e-6;
  throw new UnknownUnitError(unit, capacitanceUnits);
}

/** Voltage in volts through convert-units (V, kV). */
export function toVolts(value: number, unit: string): number {
  positive(value, 'voltage');
  const code = canonicalUnit(unit);
  if (code !== 'V' && code !== 'kV') throw new UnknownUnitError(unit, voltageUnits);
  return convert(value).from(code).to('V');
}

/** Resistance in ohms (Ω, mΩ); zero is allowed: an ideal switch. */
export function toOhms(value: number, unit: string): number {
  if (!Number.isFinite(value) || value < 0)
    throw new InvalidQuantityError('resistance must be a finite number, zero or more');
  const code = canonicalUnit(unit);
  if (code === 'ohm') return value;
  if (code === 'mohm') return value * 1e-3;
  throw new UnknownUnitError(unit, resistanceUnits);
}
