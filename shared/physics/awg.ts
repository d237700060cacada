/**
 * Bare diameter of American Wire Gauge n, m: d = 0.127 mm × 92^((36 − n)/39) (ASTM B258).
 * Gauges 0000 to 0 are n = −3 to 0.
 * @example awgDiameter(30) // 2.546e-4
 */
export function awgDiameter(gauge: number): number {
  if (!Number.isInteger(gauge) || gauge < -3 || gauge > 56)
    throw new RangeError('AWG must be an integer from -3 (0000) to 56');
  return 0.127e-3 * 92 ** ((36 - gauge) / 39);
}
