import { InvalidQuantityError } from './errors';

/**
 * Readings the linear law may correct, K: −50 °C to 200 °C. Copper's tabulated resistivity
 * (Matula, J. Phys. Chem. Ref. Data 8, 1147, 1979; figures recalled, not re-checked) stays within
 * about 2 % of its α20 line from some 200 K to 500 K; colder, it falls faster than any straight
 * line as the lattice vibrations freeze out (Bloch–Grüneisen), and at 20 K the line even turns
 * negative (1 + 0.00393 × (20 − 293.15) < 0). Handbook coefficients are quoted near room
 * temperature for alloys too. The range kept is the narrower one that sorting lines, outdoor
 * yards and warm parts fresh from a process see (common practice, no source).
 */
export const LINEAR_LAW_RANGE_K = { min: 223.15, max: 473.15 } as const;

/**
 * True when a reading at `kelvin` lies where the linear law of this file applies; the ends
 * count, to a micro-kelvin (−50 °C arrives as 223.14999999999998 K).
 */
export function withinLinearLawRange(kelvin: number): boolean {
  return kelvin >= LINEAR_LAW_RANGE_K.min - 1e-6 && kelvin <= LINEAR_LAW_RANGE_K.max + 1e-6;
}

/**
 * Conductivity at a reference temperature from one measured at another, by the linear
 * resistivity law ρ(T) = ρ_ref·[1 + α_ref·(T − T_ref)] (IEC 60028 for copper, α20 = 0.00393 /K;
 * measurement practice ASTM B193). Valid over the tens of kelvin around room temperature that
 * sorting lines see; not for magnetic alloys near their Curie point.
 *
 * @param sigmaMeasured conductivity measured at `measuredK`, S/m
 * @param measuredK temperature of the reading, K
 * @param referenceK temperature the table refers to, K
 * @param alphaPerK temperature coefficient of resistivity at `referenceK`, 1/K
 * @example conductivityAtReference(58e6, 303.15, 293.15, 0.00393) // 60.28e6: copper read at 30 °C
 */
export function conductivityAtReference(
  sigmaMeasured: number,
  measuredK: number,
  referenceK: number,
  alphaPerK: number,
): number {
  const factor = 1 + alphaPerK * (measuredK - referenceK);
  if (factor <= 0) throw new InvalidQuantityError('temperature is outside the linear range');
  return sigmaMeasured * factor;
}

/**
 * Conductivity at a temperature from its value at the reference temperature (the inverse of
 * {@link conductivityAtReference}).
 * @example conductivityAtTemperature(58e6, 293.15, 313.15, 0.00393) // 53.77e6: copper at 40 °C
 */
export function conductivityAtTemperature(
  sigmaReference: number,
  referenceK: number,
  targetK: number,
  alphaPerK: number,
): number {
  const factor = 1 + alphaPerK * (targetK - referenceK);
  if (factor <= 0) throw new InvalidQuantityError('temperature is outside the linear range');
  return sigmaReference / factor;
}
