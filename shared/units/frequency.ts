import convert from 'convert-units';
import { canonicalUnit, frequencyUnits } from './codes';
import { InvalidQuantityError, UnknownUnitError } from './errors';

/**
 * Frequency in hertz through convert-units (decimal prefixes, exact).
 * @example toHertz(60, 'kHz') // 60000
 */
export function toHertz(value: number, unit: string): number {
  const code = canonicalUnit(unit);
  if (!Number.isFinite(value) || value <= 0)
    throw new InvalidQuantityError('frequency must be a finite number greater than zero');
  if (!(frequencyUnits as readonly string[]).includes(code))
    throw new UnknownUnitError(unit, frequencyUnits);
  return convert(value)
    .from(code as 'Hz' | 'kHz' | 'MHz')
    .to('Hz');
}

export function fromHertz(hertz: number, unit: string): number {
  const code = canonicalUnit(unit);
  if (!(frequencyUnits as readonly string[]).includes(code))
    throw new UnknownUnitError(unit, frequencyUnits);
  return convert(hertz)
    .from('Hz')
    .to(code as 'Hz' | 'kHz' | 'MHz');
}
