import { describe, expect, it } from 'vitest';
import { toAmpereSquaredSeconds, toAmperes } from '../../shared/units/pulse-ratings';

describe('pulse-rating units (SI prefixes, BIPM SI Brochure)', () => {
  it('current: A and kA', () => {
    expect(toAmperes(250, 'A')).toBe(250);
    expect(toAmperes(1.2, 'kA')).toBeCloseTo(1200, 12);
    expect(() => toAmperes(1, 'mA')).toThrow(/unknown unit/);
    expect(() => toAmperes(0, 'A')).toThrow(/greater than zero/);
  });
  it('I²t: A²s and kA²s in either spelling (1 kA²s = (1e3 A)²·s = 1e6 A²s)', () => {
    expect(toAmpereSquaredSeconds(450, 'A2s')).toBe(450);
    expect(toAmpereSquaredSeconds(450, 'A²s')).toBe(450);
    expect(toAmpereSquaredSeconds(2, 'kA²s')).toBe(2e6);
    expect(toAmpereSquaredSeconds(2, 'kA2s')).toBe(2e6);
    expect(() => toAmpereSquaredSeconds(Number.NaN, 'A2s')).toThrow(/finite/);
  });
});
