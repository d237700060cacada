import ellipe from '@stdlib/math-base-special-ellipe';
import ellipk from '@stdlib/math-base-special-ellipk';
import { MU0 } from './constants';

/**
 * Mutual inductance of two coaxial circular filaments, H (Maxwell):
 * M = µ0·√(ab)·[(2/k − k)·K(k) − (2/k)·E(k)], k² = 4ab/[(a + b)² + d²],
 * K and E the complete elliptic integrals (DLMF §19.2). @stdlib's ellipk/ellipe take the
 * parameter m = k², not the modulus k.
 *
 * @param a radius of the first loop, m
 * @param b radius of the second loop, m
 * @param d axial distance between their planes, m
 * @example mutualInductance(1, 1, 1) // 4.9407846308e-7
 */
export function mutualInductance(a: number, b: number, d: number): number {
  const m = (4 * a * b) / ((a + b) ** 2 + d * d);
  const k = Math.sqrt(m);
  return MU0 * Math.sqrt(a * b) * ((2 / k - k) * ellipk(m) - (2 / k) * ellipe(m));
}

/**
 * Derivative of Maxwell's mutual inductance with respect to the axial distance d, H/m, analytic:
 * dM/dd = µ0·√(ab)·f′(k)·dk/dd with f′(k) = (2 − k²)E/(k²(1 − k²)) − 2K/k² and
 * dk/dd = −d·k³/(4ab), from dK/dk = E/(k(1−k²)) − K/k and dE/dk = (E − K)/k (DLMF 19.4.1).
 * Negative for d > 0: the coupling falls as the loops part. The axial force between the loops is
 * I1·I2·dM/dd.
 * @example mutualInductanceGradient(1, 1, 1) // −7.183656729e-7
 */
export function mutualInductanceGradient(a: number, b: number, d: number): number {
  if (d === 0) return 0;
  const m = (4 * a * b) / ((a + b) ** 2 + d * d);
  const k = Math.sqrt(m);
  const K = ellipk(m);
  const E = ellipe(m);
  const dfdk = ((2 - m) * E) / (m * (1 - m)) - (2 * K) / m;
  const dkdd = (-d * k * m) / (4 * a * b);
  return MU0 * Math.sqrt(a * b) * dfdk * dkdd;
}

/**
 * Self-inductance of a thin circular ring of radius a whose conductor has geometric mean
 * distance g from itself, H: L = µ0·a·(ln(8a/g) − 2) (Maxwell; Rosa & Grover, Bull. Bur. Stand.
 * 8, 1912). For a round wire of radius ρ, g = ρ·e^(−1/4); for a rectangle w×h, g ≈ 0.2235(w + h).
 * @example thinRingSelfInductance(0.01, 1e-4) // 4.31e-8
 */
export function thinRingSelfInductance(a: number, g: number): number {
  return MU0 * a * (Math.log((8 * a) / g) - 2);
}

/** Geometric mean distance of a rectangular cross-section from itself (Maxwell, ≈ 0.2235(w + h)). */
export function rectangleGmd(width: number, height: number): number {
  return 0.2235 * (width + height);
}

/**
 * Maxwell's M and dM/dd together, sharing one evaluation of K and E: the launch model needs both
 * for every coil–blank filament pair at every step.
 */
export function mutualInductanceAndGradient(a: number, b: number, d: number): [number, number] {
  const m = (4 * a * b) / ((a + b) ** 2 + d * d);
  const k = Math.sqrt(m);
  const K = ellipk(m);
  const E = ellipe(m);
  const root = MU0 * Math.sqrt(a * b);
  const M = root * ((2 / k - k) * K - (2 / k) * E);
  if (d === 0) return [M, 0];
  const dfdk = ((2 - m) * E) / (m * (1 - m)) - (2 * K) / m;
  return [M, root * dfdk * ((-d * k * m) / (4 * a * b))];
}
