import type { CoilGeometry } from './coil';

/**
 * Overall diameter of heavy-build (grade 2) round magnet wire over its film insulation, m, from the
 * bare diameter: d_overall = d + 0.065 mm × (d / 1 mm)^0.4. The power law is ours, fitted to the
 * nominal overall diameters of NEMA MW 1000 heavy build (equivalent to IEC 60317 grade 2) at AWG 14,
 * 26 and 30: 0.0671, 0.0178 and 0.0116 in over bare 1.628, 0.405 and 0.255 mm (ASTM B258); the
 * standard's figures are recalled, not re-checked, and the fit holds them within 1 %.
 *
 * @param bareDiameterM diameter of the conductor, m
 * @example heavyBuildDiameter(0.405e-3) // 4.5e-4: AWG 26, about 0.0178 in
 */
export function heavyBuildDiameter(bareDiameterM: number): number {
  return bareDiameterM + 0.065e-3 * (bareDiameterM / 1e-3) ** 0.4;
}

/**
 * The bare diameter whose heavy-build overall diameter is `overallDiameterM` (inverse of
 * {@link heavyBuildDiameter}, by bisection: the build grows monotonically with the wire).
 */
export function bareDiameterFor(overallDiameterM: number): number {
  let low = 0;
  let high = overallDiameterM;
  for (let i = 0; i < 200 && high - low > 1e-15 * overallDiameterM; i++) {
    const mid = (low + high) / 2;
    if (heavyBuildDiameter(mid) > overallDiameterM) high = mid;
    else low = mid;
  }
  return low;
}

/**
 * The densest a winding of round wire can be: hexagonal (orthocyclic) packing, each turn in a
 * cell of √3/2·D², fill π/(2√3) ≈ 0.907 of the window (the ideal of orthocyclic winding; layer
 * winding in square packing reaches π/4 ≈ 0.785, random winding 0.5–0.6: common practice, no
 * source). A coil above it cannot be wound however carefully.
 */
export const MAX_FILL = Math.PI / (2 * Math.sqrt(3));

/** Area of the winding window, m²: (outer − inner radius) × length. */
export function windowArea(coil: CoilGeometry): number {
  return (coil.outerRadiusM - coil.innerRadiusM) * coil.lengthM;
}

/**
 * Fill factor of a winding: the turns' overall (insulated) cross-sections, N·πD²/4, over the
 * window area. At most {@link MAX_FILL} for any coil that can be wound.
 * @example fillFactor({ innerRadiusM: 5e-3, outerRadiusM: 12e-3, lengthM: 10e-3, turns: 100 }, 4.5e-4) // 0.227
 */
export function fillFactor(coil: CoilGeometry, overallDiameterM: number): number {
  return (coil.turns * Math.PI * overallDiameterM ** 2) / 4 / windowArea(coil);
}

/**
 * Window the turns need at the densest packing, m²: N·√3/2·D² (orthocyclic).
 */
export function windowNeeded(turns: number, overallDiameterM: number): number {
  return (turns * Math.sqrt(3) * overallDiameterM ** 2) / 2;
}

/**
 * Mass of the conductor of a winding, kg: turns × mean circumference × bare wire area × density
 * (the insulation's few per cent of mass left out).
 * @example wireMass({ innerRadiusM: 5e-3, outerRadiusM: 12e-3, lengthM: 10e-3, turns: 100 }, 0.405e-3, 8890) // 6.1e-3
 */
export function wireMass(
  coil: CoilGeometry,
  bareDiameterM: number,
  densityKgPerM3: number,
): number {
  const meanRadius = (coil.innerRadiusM + coil.outerRadiusM) / 2;
  return (
    coil.turns * 2 * Math.PI * meanRadius * Math.PI * (bareDiameterM / 2) ** 2 * densityKgPerM3
  );
}

/** Density of annealed copper, kg/m³ (8.89 g/cm³, the table's C11000 nominal; ASM Handbook Vol. 2). */
export const COPPER_DENSITY_KG_PER_M3 = 8890;
