import { mutualInductance, rectangleGmd, thinRingSelfInductance } from './maxwell';

/** An air-core coil of rectangular winding section, SI. */
export interface CoilGeometry {
  innerRadiusM: number;
  outerRadiusM: number;
  lengthM: number;
  turns: number;
}

/** One circular filament standing for part of a winding or of a blank. */
export interface Filament {
  radiusM: number;
  /** Axial position of its plane, m. */
  zM: number;
  /** Turns it carries (1 for a blank's annulus). */
  turns: number;
  /** Geometric mean distance of its cross-section, for its self-inductance, m. */
  gmdM: number;
}

/**
 * Splits a coil's winding section into radial × axial cells, each a filament through its centre
 * carrying its share of the turns, with z from 0 (the face toward the work) to the coil length.
 */
export function coilFilaments(
  coil: CoilGeometry,
  radial: number,
  axial: number,
  zOffsetM = 0,
): Filament[] {
  const dr = (coil.outerRadiusM - coil.innerRadiusM) / radial;
  const dz = coil.lengthM / axial;
  const filaments: Filament[] = [];
  for (let i = 0; i < radial; i++) {
    for (let j = 0; j < axial; j++) {
      filaments.push({
        radiusM: coil.innerRadiusM + (i + 0.5) * dr,
        zM: zOffsetM - (j + 0.5) * dz,
        turns: coil.turns / (radial * axial),
        gmdM: rectangleGmd(dr, dz),
      });
    }
  }
  return filaments;
}

/**
 * Self-inductance of a winding from its filaments, H: L = Σᵢ Σⱼ nᵢnⱼ Mᵢⱼ with Maxwell's mutual
 * inductance between distinct filaments and the thin-ring formula (geometric mean distance of
 * the cell) for each filament with itself (the filament method of Grover, Inductance
 * Calculations, 1946, ch. 16).
 */
export function selfInductanceFromFilaments(filaments: Filament[]): number {
  let total = 0;
  for (let i = 0; i < filaments.length; i++) {
    const a = filaments[i]!;
    total += a.turns * a.turns * thinRingSelfInductance(a.radiusM, a.gmdM);
    for (let j = i + 1; j < filaments.length; j++) {
      const b = filaments[j]!;
      total += 2 * a.turns * b.turns * mutualInductance(a.radiusM, b.radiusM, a.zM - b.zM);
    }
  }
  return total;
}

/** DC resistance of the winding, Ω: turns × mean circumference × ρ / wire area. */
export function windingResistance(
  coil: CoilGeometry,
  wireDiameterM: number,
  conductorSPerM: number,
): number {
  const meanRadius = (coil.innerRadiusM + coil.outerRadiusM) / 2;
  const length = coil.turns * 2 * Math.PI * meanRadius;
  return length / (conductorSPerM * Math.PI * (wireDiameterM / 2) ** 2);
}
