import { InvalidQuantityError } from './errors';

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
