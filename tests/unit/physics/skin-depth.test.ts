import { describe, expect, it } from 'vitest';
import { awgDiameter } from '../../../shared/physics/awg';
import { SKIN_DEPTH } from '../../../shared/checks/references';
import { frequencyForSkinDepth, phaseLag, skinDepth } from '../../../shared/physics/skin-depth';

const COPPER = SKIN_DEPTH.conductivitySPerM; // 100 %IACS (IEC 60028)

describe('standard depth of penetration', () => {
  it.each(SKIN_DEPTH.cases)(
    `copper at $frequencyHz Hz: $depthM m (${SKIN_DEPTH.source})`,
    ({ frequencyHz, depthM }) => {
      // Within 0.5 %: the three figures physics.md gives.
      expect(Math.abs(skinDepth(frequencyHz, COPPER) / depthM - 1)).toBeLessThan(
        SKIN_DEPTH.tolerance,
      );
    },
  );

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
