import { describe, expect, it } from 'vitest';
import { integrateRk45 } from '../../../shared/physics/rk45';

describe('Dormand–Prince RK45', () => {
  it('integrates y′ = −y to e^{−t} within its tolerance', () => {
    const { t, y } = integrateRk45((_t, y, dy) => void (dy[0] = -y[0]!), 0, Float64Array.of(1), {
      rtol: 1e-9,
      atol: Float64Array.of(1e-12),
      firstStep: 1e-3,
      maxStep: 0.1,
      maxSteps: 10_000,
      onStep: (t) => t >= 1 - 1e-12,
    });
    expect(t).toBeGreaterThanOrEqual(1 - 1e-12);
    expect(Math.abs(y[0]! - Math.exp(-t)) / Math.exp(-t)).toBeLessThan(1e-8);
  });

  it('keeps the energy of a harmonic oscillator to 1e-6 over ten periods', () => {
    let last = 0;
    integrateRk45((_t, y, dy) => ((dy[0] = y[1]!), (dy[1] = -y[0]!)), 0, Float64Array.of(1, 0), {
      rtol: 1e-10,
      atol: Float64Array.of(1e-12, 1e-12),
      firstStep: 1e-3,
      maxStep: 0.5,
      maxSteps: 100_000,
      onStep: (t, y) => {
        last = y[0]! ** 2 + y[1]! ** 2;
        return t > 20 * Math.PI;
      },
    });
    expect(Math.abs(last - 1)).toBeLessThan(1e-6);
  });
});
