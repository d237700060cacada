/**
 * Warnings every estimate answers beside its numbers: a plain code a tool can rely on and a
 * sentence with the figures. The codes are ours.
 */
export type WarningCode =
  | 'magnetic-layer'
  | 'coil-heating'
  | 'projectile-hazard'
  | 'bank-over-rated-voltage'
  | 'switch-over-rating'
  | 'core-saturation';

export interface EstimateWarning {
  code: WarningCode;
  message: string;
}

/** A layer counts as magnetic from this relative permeability on (the models take µr = 1 below). */
export const MAGNETIC_FROM_MU_R = 1.05;

/** Specific heat of copper at room temperature, J/(kg·K) (CRC Handbook; physics.md). */
export const COPPER_SPECIFIC_HEAT = 385;

/**
 * The hottest the winding may get, °C: thermal class 155 (F) of IEC 60085, the usual rating of
 * heavy-build polyester-imide magnet wire (common practice, no source).
 */
export const INSULATION_CLASS_C = 155;
/** Ambient the rise is counted from, °C: 40 °C, the reference coolant temperature of IEC 60034-1 (recalled). */
export const AMBIENT_C = 40;
/** Adiabatic rise of the winding above which `coil-heating` is raised, K (155 − 40). */
export const MAX_COIL_RISE_K = INSULATION_CLASS_C - AMBIENT_C;

/**
 * Adiabatic temperature rise of a winding during a pulse, K: the energy its own resistance turned
 * into heat over the mass of its conductor times the specific heat, ΔT = E / (m·c) (the pulse is
 * far shorter than the winding's thermal time constant, so no heat leaves; c of copper at room
 * temperature, constant).
 * @example adiabaticRise(557, 6.1e-3) // 237 K
 */
export function adiabaticRise(
  energyJ: number,
  massKg: number,
  specificHeat = COPPER_SPECIFIC_HEAT,
): number {
  return energyJ / (massKg * specificHeat);
}

/**
 * Apex height above which a blank is a hazard to the people at the bench, m: 2 m, above head
 * height, so that it can strike a face or a ceiling and falls back at √(2gh) ≈ 6 m/s or more
 * (common practice, no source).
 */
export const HAZARD_HEIGHT_M = 2;
/**
 * Kinetic energy above which a blank is a hazard, J: 1 J, of the order of the muzzle energy limits
 * set for airsoft guns in several countries, projectiles for which eye protection is required
 * (recalled, no source).
 */
export const HAZARD_KINETIC_J = 1;
