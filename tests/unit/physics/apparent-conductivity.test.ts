import { describe, expect, it } from 'vitest';
import fixtures from '../../fixtures/physics/apparent-conductivity.json';
import {
  apparentConductivitySweep,
  conductivityLimits,
} from '../../../shared/physics/apparent-conductivity';
import { buildDoddDeedsKernel, type ConductorLayer } from '../../../shared/physics/dodd-deeds';

const rel = (a: number, b: number) => Math.abs(a - b) / Math.abs(b);
const SENSOR = { innerRadiusM: 2e-3, outerRadiusM: 4e-3, lengthM: 2e-3, turns: 100 };
const kernel = buildDoddDeedsKernel(SENSOR, 0.5e-3);
const CU = 58e6;
const ZN = 27.5 * 0.58e6;
const layer = (sigma: number, t: number | null): ConductorLayer => ({
  conductivitySPerM: sigma,
  relativePermeability: 1,
  thicknessM: t,
});
const platedZinc = [layer(CU, 8e-6), layer(ZN, 1.34e-3), layer(CU, 8e-6)];

describe('apparent conductivity', () => {
  // SciPy minimize_scalar on its own Dodd–Deeds integral (generate.py); 1e-4 relative covers our
  // interpolated reference curve (60 points per decade of ωσ).
  it.each(fixtures.cases)('matches the SciPy fit for $region at $frequencyHz Hz', (c) => {
    const layers = c.layers.map((l) => layer(l.sigma, l.t));
    const [p] = apparentConductivitySweep(kernel, layers, [c.frequencyHz]);
    expect(rel(p!.apparentConductivitySPerM, c.apparentConductivitySPerM)).toBeLessThan(1e-4);
    expect(Math.abs(p!.fitResidual - c.fitResidual)).toBeLessThan(1e-4);
  });

  it('reads a homogeneous plate as its own conductivity at every frequency', () => {
    const points = apparentConductivitySweep(kernel, [layer(32.5e6, 1.75e-3)], [100, 1e4, 1e6]);
    for (const p of points) {
      expect(rel(p.apparentConductivitySPerM, 32.5e6)).toBeLessThan(1e-5);
      expect(p.fitResidual).toBeLessThan(1e-5);
    }
  });

  it('tends to the thickness-weighted mean at low frequency (physics.md)', () => {
    const limits = conductivityLimits(platedZinc);
    const [low] = apparentConductivitySweep(kernel, platedZinc, [30]);
    expect(rel(low!.apparentConductivitySPerM, limits.thicknessWeightedMeanSPerM!)).toBeLessThan(
      0.005,
    );
  });

  it('tends to the face layer at high frequency (physics.md)', () => {
    const copperOnZinc = [layer(CU, 50e-6), layer(ZN, 1.3e-3)];
    const [high] = apparentConductivitySweep(kernel, copperOnZinc, [2e7]);
    expect(rel(high!.apparentConductivitySPerM, CU)).toBeLessThan(0.02);
  });

  it('gives a half-space its own σ as the low-frequency limit and no weighted mean', () => {
    expect(conductivityLimits([layer(CU, 10e-6), layer(ZN, null)])).toEqual({
      thicknessWeightedMeanSPerM: null,
      surfaceLayerSPerM: CU,
      lowFrequencySPerM: ZN,
    });
  });

  it('reports progress and honours a deadline', () => {
    const seen: number[] = [];
    apparentConductivitySweep(kernel, platedZinc, [1e3, 1e4], { onProgress: (f) => seen.push(f) });
    expect(seen).toEqual([0.5, 1]);
    expect(() =>
      apparentConductivitySweep(kernel, platedZinc, [1e3], { deadline: performance.now() - 1 }),
    ).toThrow(/compute time/);
  });
});
