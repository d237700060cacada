import { describe, expect, it } from 'vitest';
import fixtures from '../../fixtures/physics/apparent-conductivity.json';
import {
  apparentConductivitySweep,
  conductivityLimits,
} from '../../../shared/physics/apparent-conductivity';
import { buildDoddDeedsKernel, type ConductorLayer } from '../../../shared/physics/dodd-deeds';
import { APPARENT_CONDUCTIVITY } from '../../../shared/checks/references';

const rel = (a: number, b: number) => Math.abs(a - b) / Math.abs(b);
const A = APPARENT_CONDUCTIVITY;
const kernel = buildDoddDeedsKernel(A.sensor, A.liftOffM);
const CU = 58e6;
const ZN = 27.5 * 0.58e6;
const layer = (sigma: number, t: number | null): ConductorLayer => ({
  conductivitySPerM: sigma,
  relativePermeability: 1,
  thicknessM: t,
});
const platedZinc = A.lowFrequency.layers;

describe('apparent conductivity', () => {
  // SciPy minimize_scalar on its own Dodd–Deeds integral (generate.py); 1e-4 relative covers our
  // interpolated reference curve (60 points per decade of ωσ).
  it.each(fixtures.cases)('matches the SciPy fit for $region at $frequencyHz Hz', (c) => {
    const layers = c.layers.map((l) => layer(l.sigma, l.t));
    const [p] = apparentConductivitySweep(kernel, layers, [c.frequencyHz]);
    expect(rel(p!.apparentConductivitySPerM, c.apparentConductivitySPerM)).toBeLessThan(1e-4);
    expect(Math.abs(p!.fitResidual - c.fitResidual)).toBeLessThan(1e-4);
  });

  const { solidBlock, lowFrequency, thickPlating } = A;
  it(`reads a homogeneous plate as its own conductivity at every frequency (${solidBlock.source})`, () => {
    const points = apparentConductivitySweep(kernel, solidBlock.layers, solidBlock.frequenciesHz);
    for (const p of points) {
      expect(rel(p.apparentConductivitySPerM, solidBlock.conductivitySPerM)).toBeLessThan(
        solidBlock.tolerance,
      );
      expect(p.fitResidual).toBeLessThan(1e-5);
    }
  });

  it(`tends to the thickness-weighted mean at low frequency (${lowFrequency.source})`, () => {
    const limits = conductivityLimits(platedZinc);
    const [low] = apparentConductivitySweep(kernel, platedZinc, [lowFrequency.frequencyHz]);
    expect(rel(low!.apparentConductivitySPerM, limits.thicknessWeightedMeanSPerM!)).toBeLessThan(
      lowFrequency.tolerance,
    );
  });

  it(`tends to the face layer at high frequency (${thickPlating.source})`, () => {
    const [high] = apparentConductivitySweep(kernel, thickPlating.layers, [
      thickPlating.frequencyHz,
    ]);
    expect(rel(high!.apparentConductivitySPerM, thickPlating.conductivitySPerM)).toBeLessThan(
      thickPlating.tolerance,
    );
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
