import { describe, expect, it } from 'vitest';
import { awgDiameter } from '../../../shared/physics/awg';
import {
  bareDiameterFor,
  fillFactor,
  heavyBuildDiameter,
  MAX_FILL,
  windowNeeded,
  wireMass,
} from '../../../shared/physics/winding';

const inch = 25.4e-3;

describe('heavy-build magnet wire', () => {
  // NEMA MW 1000 heavy build (IEC 60317 grade 2) nominal overall diameters, recalled, not
  // re-checked: AWG 14 0.0671 in, AWG 26 0.0178 in, AWG 30 0.0116 in. The fit holds them within 1 %.
  it.each([
    [14, 0.0671],
    [26, 0.0178],
    [30, 0.0116],
  ])('AWG %d overall ≈ %f in', (gauge, overallIn) => {
    const d = heavyBuildDiameter(awgDiameter(gauge));
    expect(Math.abs(d / (overallIn * inch) - 1)).toBeLessThan(0.01);
  });
  it('bareDiameterFor inverts it', () => {
    for (const bare of [1e-5, 2.5e-4, 1.6e-3, 8e-3]) {
      expect(bareDiameterFor(heavyBuildDiameter(bare)) / bare).toBeCloseTo(1, 9);
    }
  });
});

describe('fill factor and window', () => {
  const coil = { innerRadiusM: 5e-3, outerRadiusM: 12e-3, lengthM: 10e-3, turns: 100 };
  it('the orthocyclic ideal is π/(2√3) ≈ 0.9069 (hexagonal packing of circles, geometry)', () => {
    expect(MAX_FILL).toBeCloseTo(0.9069, 4);
  });
  it('the window needed at the densest packing has exactly the ideal fill', () => {
    const d = 0.45e-3;
    const needed = windowNeeded(coil.turns, d);
    const tight = { ...coil, lengthM: needed / (coil.outerRadiusM - coil.innerRadiusM) };
    expect(fillFactor(tight, d)).toBeCloseTo(MAX_FILL, 12);
  });
  it('wire mass: turns × mean circumference × bare area × density (arithmetic)', () => {
    // 100 × 2π × 8.5 mm × π(0.2025 mm)² × 8890 kg/m³ = 6.116 g.
    expect(wireMass(coil, 0.405e-3, 8890)).toBeCloseTo(6.116e-3, 6);
  });
});
