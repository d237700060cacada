import { MU0 } from './constants';
import { OutsideModelError } from './errors';

/**
 * Standard depth of penetration δ = 1/√(π·f·µ0·µr·σ), m: the depth at which eddy-current density
 * falls to 1/e of its surface value in a half-space (e.g. ASTM E1316 terminology; any
 * electromagnetics text). Copper at 58 MS/m and 60 Hz: 8.53 mm.
 *
 * @param frequencyHz excitation frequency, Hz (> 0)
 * @param conductivitySPerM σ, S/m (> 0)
 * @param relativePermeability µr (≥ 1 for the metals here), default 1
 * @example skinDepth(60, 58e6) // 8.53e-3
 */
export function skinDepth(
  frequencyHz: number,
  conductivitySPerM: number,
  relativePermeability = 1,
): number {
  if (!(frequencyHz > 0) || !(conductivitySPerM > 0) || !(relativePermeability > 0)) {
    throw new RangeError('skin depth needs a positive frequency, conductivity and permeability');
  }
  const depth =
    1 / Math.sqrt(Math.PI * frequencyHz * MU0 * relativePermeability * conductivitySPerM);
  // f·σ so small that their product underflows: deeper than any length a double holds.
  if (!Number.isFinite(depth))
    throw new OutsideModelError(
      '/body',
      `at ${frequencyHz} Hz and ${conductivitySPerM} S/m the standard depth is beyond any length this service can express: raise the frequency`,
    );
  return depth;
}

/**
 * Phase lag of the eddy current at a depth z below the surface of a half-space, rad: z/δ (the
 * current's phase falls behind by one radian per standard depth).
 * @example phaseLag(2e-3, 1e-3) // 2
 */
export function phaseLag(depthM: number, skinDepthM: number): number {
  return depthM / skinDepthM;
}

/**
 * Frequency at which the standard depth equals a given thickness, Hz: f = 1/(π·µ0·µr·σ·t²).
 * Above it a plating of thickness t carries most of the eddy current.
 * @example frequencyForSkinDepth(25e-6, 58e6) // ≈ 6.99 MHz
 */
export function frequencyForSkinDepth(
  depthM: number,
  conductivitySPerM: number,
  relativePermeability = 1,
): number {
  return 1 / (Math.PI * MU0 * relativePermeability * conductivitySPerM * depthM * depthM);
}
