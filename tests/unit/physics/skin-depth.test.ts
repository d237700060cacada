import { describe, expect, it } from 'vitest';
import { awgDiameter } from '../../../shared/physics/awg';
import { frequencyForSkinDepth, phaseLag, skinDepth } from '../../../shared/physics/skin-depth';

const COPPER = 58e6; // 100 %IACS (IEC 60028)

describe('standard depth of penetration', () => {
  // physics.md [C], δ = 1/√(πfµ0σ): copper at 58 MS/m; 60 Hz ≈ 8.5 mm also in textbook skin-effect tables [L].
  it.each([
    [60, 8.53e-3],
    [1e3, 2.09e-3],
    [1e4, 0.661e-3],
    [1e6, 66.1e-6],
  ])('copper at %d Hz: %d m (physics.md)', (f, expected) => {
    expect(skinDepth(f, COPPER) / expected).toBeCloseTo(1, 2);
  });

  it('scales as 1/√µr for a magnetic metal', () => {
    expect(skinDepth(1e3, 7e6, 100)).toBeCloseTo(skinDepth(1e3, 7e6) / 10, 12);
  });

  it('inverts: the frequency whose depth is a plating thickness gives that depth back', () => {
    const f = frequencyForSkinDepth(25e-6, COPPER);
    expect(skinDepth(f, COPPER)).toBeCloseTo(25e-6, 12);
  });

  it('lags one radian per standard depth (NDT references, physics.md)', () => {
    expect(phaseLag(2e-3, 1e-3)).toBe(2);
  });

  it('refuses zero or negative inputs', () => {
    expect(() => skinDepth(0, COPPER)).toThrow(RangeError);
    expect(() => skinDepth(1e3, -1)).toThrow(RangeError);
  });
});

describe('AWG wire diameter (ASTM B258: 0.127 mm × 92^((36 − n)/39))', () => {
  it('has AWG 36 at 0.127 mm exactly and AWG 0000 at 0.46 in (11.684 mm)', () => {
    expect(awgDiameter(36)).toBeCloseTo(0.127e-3, 15);
    expect(awgDiameter(-3)).toBeCloseTo(11.684e-3, 6);
  });
  it('has AWG 30 at 0.2546 mm and AWG 10 at 2.588 mm (ASTM B258 table, rounded to 4 figures)', () => {
    expect(awgDiameter(30)).toBeCloseTo(0.2546e-3, 7);
    expect(awgDiameter(10)).toBeCloseTo(2.588e-3, 6);
  });
  it('refuses a gauge that is no integer', () => {
    expect(() => awgDiameter(26.5)).toThrow(RangeError);
  });
});
