import { describe, expect, it } from 'vitest';
import { MAXWELL } from '../../../shared/checks/references';
import { MU0 } from '../../../shared/physics/constants';
import { coilFilaments, selfInductanceFromFilaments } from '../../../shared/physics/coil';
import {
  mutualInductance,
  mutualInductanceAndGradient,
  mutualInductanceGradient,
  thinRingSelfInductance,
} from '../../../shared/physics/maxwell';

const rel = (a: number, b: number) => Math.abs(a - b) / Math.abs(b);

describe("Maxwell's mutual inductance of coaxial loops", () => {
  // physics.md's figures were computed with µ0 = 4π×10⁻⁷; ours is CODATA 2018's, 5.5e-10 away.
  const u = MAXWELL.unitLoops;
  it(`gives 4.9407846308e-7 H and dM/dd = −7.183656729e-7 H/m at a = b = d = 1 m (${u.source})`, () => {
    expect(rel(mutualInductance(u.a, u.b, u.d), u.mutualInductanceH)).toBeLessThan(u.tolerance);
    expect(rel(mutualInductanceGradient(u.a, u.b, u.d), u.gradientHPerM)).toBeLessThan(u.tolerance);
  });

  // Fixture: mpmath at 30 digits (tests/fixtures/physics/generate.py). Tolerance 1e-12, and 1e-8
  // for the near-touching pair (d/a = 1e-4), where K(m) has its logarithmic singularity.
  const m = MAXWELL.mpmath;
  it.each(m.cases)(`matches mpmath for a=$a b=$b d=$d (${m.source})`, (c) => {
    const { a, b, d, M, dMdd } = c;
    const tolerance = m.tolerance(c);
    expect(rel(mutualInductance(a, b, d), M), `M(${a},${b},${d})`).toBeLessThan(tolerance);
    expect(rel(mutualInductanceGradient(a, b, d), dMdd), `dM/dd(${a},${b},${d})`).toBeLessThan(
      tolerance * m.gradientFactor,
    );
    const [m2, g2] = mutualInductanceAndGradient(a, b, d);
    expect(m2).toBe(mutualInductance(a, b, d));
    expect(g2).toBe(mutualInductanceGradient(a, b, d));
  });

  it('is reciprocal: M(a, b, d) = M(b, a, d)', () => {
    for (const [a, b, d] of [
      [0.003, 0.011, 0.002],
      [0.05, 0.01, 0.0001],
      [1, 2, 3],
    ] as const) {
      expect(mutualInductance(a, b, d)).toBeCloseTo(mutualInductance(b, a, d), 20);
      expect(rel(mutualInductance(a, b, d), mutualInductance(b, a, d))).toBeLessThan(1e-14);
    }
  });

  it('tends to µ0·a·(ln(8a/d) − 2) as the gap closes (physics.md thin-gap limit)', () => {
    const a = 0.01;
    for (const d of [1e-5, 1e-6]) {
      const limit = MU0 * a * (Math.log((8 * a) / d) - 2);
      expect(rel(mutualInductance(a, a, d), limit)).toBeLessThan(1e-5);
    }
  });

  it('has a gradient equal to the central difference of M', () => {
    const [a, b, d, h] = [0.01, 0.008, 0.004, 1e-7];
    const fd = (mutualInductance(a, b, d + h) - mutualInductance(a, b, d - h)) / (2 * h);
    expect(rel(mutualInductanceGradient(a, b, d), fd)).toBeLessThan(1e-6);
  });
});

describe('self-inductance', () => {
  it('of a thin ring of round wire: µ0·a·(ln(8a/ρ) − 7/4) with g = ρ·e^(−1/4) (Rosa & Grover 1912)', () => {
    const [a, rho] = [0.05, 0.5e-3];
    expect(
      rel(
        thinRingSelfInductance(a, rho * Math.exp(-0.25)),
        MU0 * a * (Math.log((8 * a) / rho) - 1.75),
      ),
    ).toBeLessThan(1e-14);
  });

  it('of a winding from filaments converges as the cells shrink', () => {
    const coil = { innerRadiusM: 6.15e-3, outerRadiusM: 12.4e-3, lengthM: 6.15e-3, turns: 3790 };
    const coarse = selfInductanceFromFilaments(coilFilaments(coil, 8, 8));
    const fine = selfInductanceFromFilaments(coilFilaments(coil, 16, 16));
    expect(rel(coarse, fine)).toBeLessThan(5e-4);
  });
});
