import { describe, expect, it } from 'vitest';
import fixtures from '../../fixtures/physics/dodd-deeds.json';
import { coilFilaments, selfInductanceFromFilaments } from '../../../shared/physics/coil';
import {
  buildDoddDeedsKernel,
  coilInAirInductance,
  impedanceAt,
  type ConductorLayer,
} from '../../../shared/physics/dodd-deeds';
import { TEAM_15_1 } from '../../../shared/checks/references';

const rel = (a: number, b: number) => Math.abs(a - b) / Math.abs(b);
type FixtureCoil = { r1: number; r2: number; h: number; n: number };
type FixtureLayer = { sigma: number; mu: number; t: number | null };
const coilOf = (c: FixtureCoil) => ({
  innerRadiusM: c.r1,
  outerRadiusM: c.r2,
  lengthM: c.h,
  turns: c.n,
});
const layersOf = (ls: FixtureLayer[]): ConductorLayer[] =>
  ls.map((l) => ({ conductivitySPerM: l.sigma, relativePermeability: l.mu, thicknessM: l.t }));

const { coil: TEAM_COIL, plate: TEAM_PLATE, finiteElement: FE, measured } = TEAM_15_1;

describe(`Dodd–Deeds against ${TEAM_15_1.source}`, () => {
  const kernel = buildDoddDeedsKernel(TEAM_COIL, TEAM_15_1.liftOffM);
  const point = impedanceAt(kernel, TEAM_PLATE, TEAM_15_1.frequencyHz);
  // FE.source: L0 ≈ 225.9 mH, L over the plate ≈ 178.63 mH, ΔR ≈ 120.67 Ω. The issue asks 0.5 %; we hold 0.1 %.
  it(`L0 within 0.1 % of 225.9 mH (${FE.source})`, () =>
    expect(rel(point.inductanceInAirH, FE.inductanceInAirH)).toBeLessThan(FE.tolerance));
  it(`L over the plate within 0.1 % of 178.63 mH (${FE.source})`, () =>
    expect(rel(point.inductanceOverConductorH, FE.inductanceOverPlateH)).toBeLessThan(
      FE.tolerance,
    ));
  it(`ΔR within 0.1 % of 120.67 Ω (${FE.source})`, () =>
    expect(rel(point.deltaResistanceOhm, FE.deltaResistanceOhm)).toBeLessThan(FE.tolerance));
  it(`sits 2 % above the measured 221.8 mH of the real winding, as physics.md expects of the nominal geometry (${measured.source})`, () => {
    expect(rel(point.inductanceInAirH, measured.inductanceInAirH)).toBeLessThan(measured.tolerance);
  });
});

describe('Dodd–Deeds against the SciPy fixtures (tests/fixtures/physics/generate.py)', () => {
  // Tolerances per region, the smallest that pass (all regions agree to ~1e-13 on ΔZ; L0 to
  // ~2e-11, the accuracy of QUADPACK's sum of the slowly decaying air term).
  const tolerance: Record<string, { l0: number; dz: number }> = {
    'team-15-1': { l0: 1e-10, dz: 1e-12 },
    'thin-copper-film': { l0: 1e-10, dz: 1e-12 },
    'thick-aluminium-plate': { l0: 1e-10, dz: 1e-12 },
    'zinc-half-space': { l0: 1e-10, dz: 1e-12 },
    'magnetic-half-space': { l0: 1e-10, dz: 1e-12 },
    'copper-plated-steel': { l0: 1e-10, dz: 1e-12 },
    'copper-plated-zinc': { l0: 1e-10, dz: 1e-12 },
    'cupronickel-clad-copper': { l0: 1e-10, dz: 1e-12 },
  };
  it.each(fixtures.cases)('$region at $frequencyHz Hz', (c) => {
    const kernel = buildDoddDeedsKernel(coilOf(c.coil), c.liftOff);
    const p = impedanceAt(kernel, layersOf(c.layers as FixtureLayer[]), c.frequencyHz);
    const tol = tolerance[c.region]!;
    const report = (name: string, actual: number, expected: number, t: number) =>
      `${c.region} ${c.frequencyHz} Hz ${name}: actual ${actual}, expected ${expected}, difference ${rel(actual, expected)}, tolerance ${t}`;
    expect(
      rel(p.inductanceInAirH, c.L0),
      report('L0', p.inductanceInAirH, c.L0, tol.l0),
    ).toBeLessThan(tol.l0);
    const dzScale = Math.hypot(c.dR, c.dX);
    expect(
      Math.abs(p.deltaResistanceOhm - c.dR) / dzScale,
      report('ΔR', p.deltaResistanceOhm, c.dR, tol.dz),
    ).toBeLessThan(tol.dz);
    expect(
      Math.abs(p.deltaReactanceOhm - c.dX) / dzScale,
      report('ΔX', p.deltaReactanceOhm, c.dX, tol.dz),
    ).toBeLessThan(tol.dz);
  });
});

describe('Dodd–Deeds properties', () => {
  it('converges: doubling the panels changes ΔZ by less than 1e-10', () => {
    const a = impedanceAt(buildDoddDeedsKernel(TEAM_COIL, 0.88e-3), TEAM_PLATE, 900);
    const b = impedanceAt(buildDoddDeedsKernel(TEAM_COIL, 0.88e-3, { refine: 1 }), TEAM_PLATE, 900);
    expect(rel(a.deltaResistanceOhm, b.deltaResistanceOhm)).toBeLessThan(1e-10);
    expect(rel(a.deltaReactanceOhm, b.deltaReactanceOhm)).toBeLessThan(1e-10);
  });

  it('gives the coil in air the same inductance as the filament method (Grover), within 0.05 %', () => {
    const filaments = selfInductanceFromFilaments(coilFilaments(TEAM_COIL, 16, 16));
    expect(
      rel(coilInAirInductance(buildDoddDeedsKernel(TEAM_COIL, 0.88e-3)), filaments),
    ).toBeLessThan(5e-4);
  });

  it('treats a plate much thicker than the skin depth as a half-space (≈ 3δ rule, common practice)', () => {
    const k = buildDoddDeedsKernel(TEAM_COIL, 0.88e-3);
    const plate = impedanceAt(
      k,
      [{ conductivitySPerM: 30.6e6, relativePermeability: 1, thicknessM: 20e-3 }],
      10e3,
    );
    const half = impedanceAt(
      k,
      [{ conductivitySPerM: 30.6e6, relativePermeability: 1, thicknessM: null }],
      10e3,
    );
    expect(rel(plate.deltaResistanceOhm, half.deltaResistanceOhm)).toBeLessThan(1e-6);
  });

  it('lowers the inductance over a non-magnetic conductor and raises it over a magnetic one at low frequency', () => {
    const k = buildDoddDeedsKernel(
      { innerRadiusM: 2e-3, outerRadiusM: 4e-3, lengthM: 2e-3, turns: 100 },
      0.5e-3,
    );
    const copper = impedanceAt(
      k,
      [{ conductivitySPerM: 58e6, relativePermeability: 1, thicknessM: null }],
      1e5,
    );
    const steel = impedanceAt(
      k,
      [{ conductivitySPerM: 7e6, relativePermeability: 100, thicknessM: null }],
      50,
    );
    expect(copper.normalizedReactance).toBeLessThan(1);
    expect(steel.normalizedReactance).toBeGreaterThan(1);
    expect(copper.normalizedResistance).toBeGreaterThan(0);
  });
});
