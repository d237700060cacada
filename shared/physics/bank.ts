/**
 * Time to charge a capacitor bank from empty to the energy it stores, from a supply of constant
 * output power: t = E / P. A switch-mode charger (a bench supply's constant-power mode, or a
 * battery and an inverter) works near constant power; a supply that charges through a resistor
 * wastes as much as it stores and takes about 5RC to come within 1 % (common practice, no source).
 * @example chargeTime(4, 2) // 2 s: 50 µF at 400 V from a 2 W inverter
 */
export function chargeTime(storedJ: number, supplyPowerW: number): number {
  return storedJ / supplyPowerW;
}
