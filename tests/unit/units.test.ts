import { describe, expect, it } from 'vitest';
import {
  fromSiemensPerMetre,
  IACS_100_S_PER_M,
  isResistivityUnit,
  percentIacs,
  toSiemensPerMetre,
} from '../../shared/units/conductivity';
import { fromKilogramsPerCubicMetre, toKilogramsPerCubicMetre } from '../../shared/units/density';
import { InvalidQuantityError, UnknownUnitError } from '../../shared/units/errors';
import { toHertz } from '../../shared/units/frequency';
import { fromMetres, toMetres } from '../../shared/units/length';
import { quantityToSI } from '../../shared/units/quantity';
import { fromKelvin, toKelvin } from '../../shared/units/temperature';

describe('conductivity and resistivity', () => {
  it('defines 100 %IACS as 58.0 MS/m (IEC 60028; ASTM E1004: 0.58e8 S/m)', () => {
    expect(IACS_100_S_PER_M).toBe(58.0e6);
    expect(toSiemensPerMetre(100, '%IACS')).toBe(58.0e6);
  });

  it('puts 100 %IACS at 1.7241 µΩ·cm (IEC 60028: 1/58 Ω·mm²/m, given to five figures)', () => {
    expect(fromSiemensPerMetre(58e6, 'uohm_cm')).toBeCloseTo(1.7241, 4);
    expect(percentIacs(toSiemensPerMetre(1.7241, 'uohm_cm'))).toBeCloseTo(100, 2); // 1.7241 is rounded to five figures
  });

  it('follows %IACS = 172.41 / ρ[µΩ·cm] (physics.md, from IEC 60028)', () => {
    for (const rho of [1.59, 6.16, 72]) {
      expect(percentIacs(toSiemensPerMetre(rho, 'uohm_cm'))).toBeCloseTo(172.41 / rho, 2);
    }
  });

  it('converts between every conductivity and resistivity unit and back', () => {
    const sigma = 16.24e6;
    for (const unit of ['S/m', 'MS/m', '%IACS', 'ohm_m', 'uohm_cm', 'nohm_m']) {
      expect(toSiemensPerMetre(fromSiemensPerMetre(sigma, unit), unit)).toBeCloseTo(sigma, 3);
    }
    expect(fromSiemensPerMetre(sigma, 'MS/m')).toBeCloseTo(16.24, 10);
    expect(fromSiemensPerMetre(1e8, 'nohm_m')).toBeCloseTo(10, 10); // 1/(1e8 S/m) = 1e-8 Ω·m = 10 nΩ·m
    expect(fromSiemensPerMetre(1e8, 'ohm_m')).toBeCloseTo(1e-8, 20);
  });

  it('accepts the Unicode spellings µΩ·cm, Ω·m and nΩ·m', () => {
    expect(toSiemensPerMetre(1.7241, 'µΩ·cm')).toBe(toSiemensPerMetre(1.7241, 'uohm_cm'));
    expect(toSiemensPerMetre(1e-8, 'Ω·m')).toBe(1e8);
    expect(toSiemensPerMetre(10, 'nΩ·m')).toBeCloseTo(1e8, 0);
    expect(isResistivityUnit('µΩ·cm')).toBe(true);
    expect(isResistivityUnit('%IACS')).toBe(false);
  });

  it('refuses unknown units, zero, negative and NaN with a clear message', () => {
    expect(() => toSiemensPerMetre(1, 'furlong')).toThrow(UnknownUnitError);
    expect(() => toSiemensPerMetre(1, 'furlong')).toThrow(
      /unknown unit 'furlong': use one of S\/m/,
    );
    expect(() => toSiemensPerMetre(0, '%IACS')).toThrow(InvalidQuantityError);
    expect(() => toSiemensPerMetre(-5, 'MS/m')).toThrow(/greater than zero/);
    expect(() => toSiemensPerMetre(Number.NaN, 'MS/m')).toThrow(/finite/);
  });
});

describe('length (NIST SP 811, appendix B: exact inch)', () => {
  it('has 1 in = 25.4 mm exactly and 1 mil = 25.4 µm exactly', () => {
    expect(toMetres(1, 'in')).toBe(0.0254);
    expect(toMetres(1, 'mil')).toBe(0.0000254);
    expect(fromMetres(25.4e-6, 'um')).toBeCloseTo(25.4, 12);
    expect(toMetres(1000, 'mil')).toBeCloseTo(toMetres(1, 'in'), 15);
  });
  it('converts mm, m and µm', () => {
    expect(toMetres(1.75, 'mm')).toBeCloseTo(1.75e-3, 15);
    expect(toMetres(25, 'µm')).toBeCloseTo(25e-6, 15);
    expect(fromMetres(0.0254, 'mm')).toBeCloseTo(25.4, 12);
  });
  it('refuses an unknown length unit', () => {
    expect(() => toMetres(1, 'ft')).toThrow(/unknown unit 'ft'/);
  });
});

describe('temperature', () => {
  it('converts °C, °F and K (NIST SP 811: T/K = t/°C + 273.15; °F = 1.8·°C + 32)', () => {
    expect(toKelvin(20, 'C')).toBeCloseTo(293.15, 10);
    expect(toKelvin(68, 'F')).toBeCloseTo(293.15, 10);
    expect(toKelvin(20, '°C')).toBeCloseTo(293.15, 10);
    expect(fromKelvin(373.15, 'F')).toBeCloseTo(212, 10);
  });
  it('refuses temperatures at or below absolute zero', () => {
    expect(() => toKelvin(-300, 'C')).toThrow(/absolute zero/);
    expect(() => toKelvin(0, 'K')).toThrow(/absolute zero/);
  });
});

describe('density and frequency', () => {
  it('has 1 lb/in³ = 27 679.9047 kg/m³ (NIST SP 811: 1 lb = 0.45359237 kg, 1 in = 0.0254 m)', () => {
    expect(toKilogramsPerCubicMetre(1, 'lb/in3')).toBeCloseTo(27679.9047, 3);
    // Mill data sheets for C26000 give 0.308 lb/in³ beside 8.53 g/cm³.
    expect(toKilogramsPerCubicMetre(0.308, 'lb/in3') / 1000).toBeCloseTo(8.53, 2);
    expect(fromKilogramsPerCubicMetre(8530, 'g/cm³')).toBeCloseTo(8.53, 12);
  });
  it('converts kHz and MHz to Hz', () => {
    expect(toHertz(60, 'kHz')).toBe(60000);
    expect(toHertz(1, 'MHz')).toBe(1e6);
    expect(() => toHertz(0, 'Hz')).toThrow(/greater than zero/);
  });
  it('dispatches a quantity by kind', () => {
    expect(quantityToSI('conductivity', { value: 28, unit: '%IACS' })).toBeCloseTo(16.24e6, 3);
    expect(quantityToSI('length', { value: 1, unit: 'mil' })).toBe(2.54e-5);
  });
});
