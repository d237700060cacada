import { describe, expect, it } from 'vitest';
import {
  conductivityAtReference,
  conductivityAtTemperature,
} from '../../shared/units/temperature-correction';

// IEC 60028: annealed copper has α20 = 0.00393 /K, so ρ(T) = ρ20·[1 + 0.00393·(T − 20 °C)].
const ALPHA_COPPER = 0.00393;

describe('temperature correction of conductivity (linear law, IEC 60028)', () => {
  it('lowers copper from 58.0 MS/m at 20 °C to 53.77 MS/m at 40 °C (arithmetic of IEC 60028)', () => {
    expect(conductivityAtTemperature(58e6, 293.15, 313.15, ALPHA_COPPER)).toBeCloseTo(
      58e6 / 1.0786,
      0,
    );
  });

  it('brings a warm reading back to the reference temperature', () => {
    const warm = conductivityAtTemperature(58e6, 293.15, 308.15, ALPHA_COPPER);
    expect(conductivityAtReference(warm, 308.15, 293.15, ALPHA_COPPER)).toBeCloseTo(58e6, 3);
  });

  it('leaves a reading at the reference temperature alone', () => {
    expect(conductivityAtReference(16.24e6, 293.15, 293.15, 0.0011)).toBe(16.24e6);
  });

  it('refuses a temperature so far out that the linear law turns negative', () => {
    expect(() => conductivityAtTemperature(58e6, 293.15, 293.15 - 300, ALPHA_COPPER)).toThrow(
      /linear range/,
    );
  });
});
