import { InvalidQuantityError, UnknownUnitError } from './errors';

/**
 * Units of a switch's pulse ratings, as datasheets print them: surge current in A or kA, I²t in
 * A²s or kA²s (1 kA²s = 1e6 A²s). Kept apart from quantity.ts so that the two can change
 * independently; the API takes the ASCII spellings as well.
 */
export const currentUnits = ['A', 'kA'] as const;
export const i2tUnits = ['A2s', 'A²s', 'kA2s', 'kA²s'] as const;

function positive(value: number, what: string): void {
  if (!Number.isFinite(value) || value <= 0)
    throw new InvalidQuantityError(`${what} must be a finite number greater than zero`);
}

/**
 * Current in amperes.
 * @example toAmperes(1.2, 'kA') // 1200
 */
export function toAmperes(value: number, unit: string): number {
  positive(value, 'current');
  if (unit === 'A') return value;
  if (unit === 'kA') return value * 1e3;
  throw new UnknownUnitError(unit, currentUnits);
}

/**
 * Let-through integral ∫i²dt in A²s.
 * @example toAmpereSquaredSeconds(2, 'kA²s') // 2e6
 */
export function toAmpereSquaredSeconds(value: number, unit: string): number {
  positive(value, 'I²t');
  if (unit === 'A2s' || unit === 'A²s') return value;
  if (unit === 'kA2s' || unit === 'kA²s') return value * 1e6;
  throw new UnknownUnitError(unit, i2tUnits);
}

export const fluxDensityUnits = ['T', 'mT'] as const;
export const powerUnits = ['W', 'kW'] as const;

/**
 * Magnetic flux density in teslas (a core's saturation flux density, as steel datasheets print it).
 * @example toTeslas(1500, 'mT') // 1.5
 */
export function toTeslas(value: number, unit: string): number {
  positive(value, 'flux density');
  if (unit === 'T') return value;
  if (unit === 'mT') return value * 1e-3;
  throw new UnknownUnitError(unit, fluxDensityUnits);
}

/**
 * Power in watts (the output of the supply that charges a bank).
 * @example toWatts(0.5, 'kW') // 500
 */
export function toWatts(value: number, unit: string): number {
  positive(value, 'power');
  if (unit === 'W') return value;
  if (unit === 'kW') return value * 1e3;
  throw new UnknownUnitError(unit, powerUnits);
}
