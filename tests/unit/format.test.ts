import { describe, expect, it } from 'vitest';
import {
  conductivityQuantityName,
  describeValueChange,
  formatRelativePercent,
  formatShare,
  formatSiPrefixed,
  fieldName,
  formatConductivity,
  formatConductivityOverDensity,
  formatEditable,
  formatFrequency,
  formatLength,
  formatNumber,
  formatTick,
} from '../../frontend/lib/format';
import { reasonInUnits } from '../../frontend/features/match/reason-units';

const iacs = { conductivity: '%IACS', density: 'g/cm3' } as const;
const micro = { conductivity: 'uohm_cm', density: 'kg/m3' } as const;

describe('one number style (issue 9, item 2)', () => {
  it('writes significant figures, whole numbers up to 10⁵ and × 10ⁿ beyond, never "e+"', () => {
    expect(formatNumber(2263.4)).toBe('2260'); // toPrecision(3) would say "2.26e+3"
    expect(formatNumber(28)).toBe('28.0');
    expect(formatNumber(16.24e6)).toBe('1.62 × 10⁷');
    expect(formatNumber(4.38e-4)).toBe('4.38 × 10⁻⁴');
    expect(formatNumber(99_999)).toBe('100000');
    for (const v of [1.5e3, 12345, 6.02e23, 1e-9, 0.5, 123.456])
      expect(formatNumber(v)).not.toMatch(/e[+-]/);
  });

  it('drops trailing zeros on chart ticks and edits', () => {
    expect(formatTick(20)).toBe('20');
    expect(formatTick(2.5)).toBe('2.5');
    expect(formatTick(1e6)).toBe('1 × 10⁶');
    expect(formatEditable(16.24e6)).toBe('16240000');
    expect(formatEditable(1e-7)).toBe('0.0000001');
  });

  it('writes frequencies and lengths with their units', () => {
    expect(formatFrequency(60e3)).toBe('60 kHz');
    expect(formatFrequency(1e6)).toBe('1 MHz');
    // δ of copper at 1 MHz, 65.8 µm (tests/e2e/estimators.test.ts)
    expect(formatLength(65.8e-6)).toBe('65.8 µm');
  });

  it('writes SI figures with the prefix that suits them (the Checks screen)', () => {
    // TEAM 15-1's L0 and ΔR, physics.md
    expect(formatSiPrefixed(225.9e-3, 'H', 4)).toBe('225.9 mH');
    expect(formatSiPrefixed(120.67, 'ohm', 5)).toBe('120.67 Ω');
    expect(formatSiPrefixed(8.53e-3, 'm')).toBe('8.53 mm');
    expect(formatSiPrefixed(-7.183656729e-7, 'H/m', 4)).toBe('-718.4 nH/m');
    expect(formatSiPrefixed(58e6, 'S/m')).toBe('58.0 MS/m');
    expect(formatSiPrefixed(1e-3, 'H')).toBe('1.00 mH');
    expect(formatSiPrefixed(0, 'J')).toBe('0.00 J');
  });

  it('writes relative differences and tolerances as percentages, × 10ⁿ when tiny', () => {
    expect(formatRelativePercent(3.89e-4)).toBe('0.039 %');
    expect(formatRelativePercent(1e-3)).toBe('0.1 %');
    expect(formatRelativePercent(2.14e-15)).toBe('2.1 × 10⁻¹³ %');
    expect(formatRelativePercent(0)).toBe('0 %');
  });

  it('writes shares of a whole to one decimal', () => {
    expect(formatShare(10, 167)).toBe('6.0 %');
    expect(formatShare(157, 167)).toBe('94.0 %');
    expect(formatShare(0, 0)).toBe('—');
  });
});

describe('resistivity is labelled resistivity', () => {
  it('names the quantity by the unit', () => {
    expect(conductivityQuantityName('%IACS')).toBe('Conductivity');
    expect(conductivityQuantityName('MS/m')).toBe('Conductivity');
    expect(conductivityQuantityName('uohm_cm')).toBe('Resistivity');
    expect(conductivityQuantityName('µΩ·cm')).toBe('Resistivity');
    expect(conductivityQuantityName('nohm_m')).toBe('Resistivity');
    expect(fieldName('values.conductivity', micro)).toBe('Resistivity');
    expect(fieldName('values.density', iacs)).toBe('Density');
  });

  it('converts: 28 %IACS = 16.24 MS/m = 6.158 µΩ·cm (100 %IACS = 58.0 MS/m, IEC 60028)', () => {
    expect(formatConductivity(16.24e6, '%IACS')).toBe('28.0 %IACS');
    expect(formatConductivity(16.24e6, 'MS/m')).toBe('16.2 MS/m');
    expect(formatConductivity(16.24e6, 'uohm_cm')).toBe('6.16 µΩ·cm');
  });

  it('gives σ/ρ in the chosen units, and in MS/m under a resistivity choice', () => {
    // 16.24 MS/m over 8.53 g/cm³ = 1.904 (MS/m)/(g/cm³) = 3.28 (%IACS)/(g/cm³) (arithmetic)
    expect(formatConductivityOverDensity(16.24e6 / 8530, iacs)).toBe('3.28 (%IACS)/(g/cm³)');
    expect(formatConductivityOverDensity(16.24e6 / 8530, micro)).toBe('0.00190 (MS/m)/(kg/m³)');
  });
});

describe('curation diffs in the chosen units (issue 9, item 3)', () => {
  const before = { nominal: 37 * 0.58e6, min: 36 * 0.58e6, max: 38 * 0.58e6 };
  it('says a kept range is unchanged instead of repeating SI', () => {
    const change = describeValueChange('conductivity', before, { nominal: 36.5 * 0.58e6 }, iacs);
    expect(change.before).toBe('37.0 %IACS (range 36.0–38.0 %IACS)');
    expect(change.after).toBe('36.5 %IACS (range unchanged)');
  });

  it('shows a new range in the chosen unit, ends in order under resistivity', () => {
    const change = describeValueChange(
      'conductivity',
      before,
      { nominal: 36.5 * 0.58e6, min: 35 * 0.58e6, max: 38 * 0.58e6 },
      micro,
    );
    expect(change.after).toBe('4.72 µΩ·cm (range 4.54–4.93 µΩ·cm)');
    expect(change.after).not.toMatch(/\d{7,}/);
  });
});

describe('Match reasons in the chosen units', () => {
  // the reasons' wording: tests/api/match.test.ts
  const inside = '28.0 %IACS at 20 °C lies inside 27.0–29.0 %IACS';
  it('rewrites %IACS and g/cm³ figures', () => {
    expect(reasonInUnits(inside, iacs)).toBe(inside);
    expect(reasonInUnits(inside, { conductivity: 'MS/m', density: 'g/cm3' })).toBe(
      '16.2 MS/m at 20 °C lies inside 15.7–16.8 MS/m',
    );
    expect(reasonInUnits(inside, micro)).toBe('6.16 µΩ·cm at 20 °C lies inside 5.95–6.39 µΩ·cm');
    expect(reasonInUnits('density 8.53 g/cm³ matches 8.53 g/cm³', micro)).toBe(
      'density 8530 kg/m³ matches 8530 kg/m³',
    );
  });

  it('restates a reading outside a range as a resistivity above it under a resistivity choice', () => {
    const below = '25.0 %IACS at 20 °C lies 2.00 %IACS below 27.0–29.0 %IACS';
    expect(reasonInUnits(below, { conductivity: 'MS/m', density: 'g/cm3' })).toBe(
      '14.5 MS/m at 20 °C lies 1.16 MS/m below 15.7–16.8 MS/m',
    );
    expect(reasonInUnits(below, micro)).toBe(
      '6.90 µΩ·cm at 20 °C lies 0.511 µΩ·cm above 5.95–6.39 µΩ·cm',
    );
  });
});
