import { describe, expect, it } from 'vitest';
import { seededUniform } from '../../../shared/physics/random';
import {
  evaluateSortPlan,
  overlapsOf,
  separability,
  type PlanInput,
  type PlanMaterial,
  type PlanWindow,
} from '../../../shared/physics/sort-plan';
import { skinDepth } from '../../../shared/physics/skin-depth';
import { apparentConductivitySweep } from '../../../shared/physics/apparent-conductivity';
import { buildDoddDeedsKernel } from '../../../shared/physics/dodd-deeds';

const MS = 1e6;
const um = 1e-6;
const mm = 1e-3;
const COIL = { innerRadiusM: 1.5 * mm, outerRadiusM: 3 * mm, lengthM: 2 * mm, turns: 100 };

function material(label: string, min: number, max: number, alpha = 0): PlanMaterial {
  return {
    label,
    conductivity: { nominal: (min + max) / 2, min, max },
    referenceTemperatureK: 293.15,
    alpha: { nominal: alpha, low: alpha, high: alpha },
    relativePermeability: 1,
  };
}

function plan(overrides: Partial<PlanInput>): PlanInput {
  return {
    coil: COIL,
    frequenciesHz: [1e3, 1e4, 1e5],
    liftOffM: { min: 0.5 * mm, max: 0.5 * mm },
    temperatureK: { min: 293.15, max: 293.15 },
    platingTolerance: 0,
    materials: [],
    products: [],
    method: { kind: 'interval' },
    ...overrides,
  };
}

const window = (product: string, lo: number, hi: number): PlanWindow => ({
  product,
  lowSPerM: lo,
  highSPerM: hi,
  lowPercentIacs: 0,
  highPercentIacs: 0,
  impedance: { resistance: [0, 0], reactance: [0, 0] },
});

describe('separability and overlaps (the documented definitions)', () => {
  it('gap over mean width: [1, 2] and [3, 4] are one width apart; [1, 3] and [2, 4] overlap by half', () => {
    // Arithmetic of the definition in openapi.yaml, no source.
    expect(separability([window('a', 1, 2), window('b', 3, 4)])).toBeCloseTo(1, 12);
    expect(separability([window('a', 1, 3), window('b', 2, 4)])).toBeCloseTo(-0.5, 12);
    expect(separability([window('a', 1, 2)])).toBeNull();
    expect(overlapsOf([window('a', 1, 3), window('b', 2, 4)])).toEqual([
      { a: 'a', b: 'b', fraction: 0.5 },
    ]);
    expect(overlapsOf([window('a', 1, 2), window('b', 2, 3)])).toEqual([]);
    expect(overlapsOf([window('a', 1, 4), window('b', 2, 2)])).toEqual([
      { a: 'a', b: 'b', fraction: 1 },
    ]);
  });
});

describe('known physics', () => {
  it('two solid alloys of equal conductivity overlap fully at every frequency', () => {
    // Two materials with the same range read the same: identical windows (physics, no source).
    const result = evaluateSortPlan(
      plan({
        frequenciesHz: [100, 1e3, 1e4, 1e5, 1e6],
        liftOffM: { min: 0.4 * mm, max: 0.6 * mm },
        temperatureK: { min: 283.15, max: 313.15 },
        materials: [material('a', 20 * MS, 21 * MS, 0.002), material('b', 20 * MS, 21 * MS, 0.002)],
        products: [
          { name: 'A', layers: [{ material: 0, thicknessM: 2 * mm }] },
          { name: 'B', layers: [{ material: 1, thicknessM: 2 * mm }] },
        ],
      }),
    );
    for (const f of result.frequencies) {
      expect(f.overlaps).toEqual([{ a: 'A', b: 'B', fraction: 1 }]);
      expect(f.separability!).toBeLessThan(0);
    }
  });

  it('copper-plated zinc and solid zinc overlap at low frequency and separate where the skin depth nears the plating', () => {
    // Estmark 1 mark (seeds/demo/estmark.ts): 8 µm copper each face on 1.34 mm zinc; copper
    // 58.0–58.9 MS/m and zinc 16.0–16.8 MS/m, round figures in the table's ranges (physics.md).
    const copper = material('copper', 58 * MS, 58.9 * MS, 0.00393);
    const zinc = material('zinc', 16 * MS, 16.8 * MS, 0.0037);
    // δ of copper equals the 8 µm plating at f = 1/(πµ0σδ²) ≈ 68 MHz (physics.md's δ formula).
    const fPlating = 1 / (Math.PI * 4e-7 * Math.PI * 58 * MS * (8 * um) ** 2);
    expect(skinDepth(fPlating, 58 * MS, 1)).toBeCloseTo(8 * um, 9);
    const result = evaluateSortPlan(
      plan({
        frequenciesHz: [100, fPlating],
        materials: [copper, zinc],
        products: [
          {
            name: 'plated',
            layers: [
              { material: 0, thicknessM: 8 * um },
              { material: 1, thicknessM: 1.34 * mm },
              { material: 0, thicknessM: 8 * um },
            ],
          },
          { name: 'solid zinc', layers: [{ material: 1, thicknessM: 1.356 * mm }] },
        ],
      }),
    );
    const [low, high] = result.frequencies;
    // Low frequency: the thickness-weighted mean, 16.0·1.34/1.356 + 58·0.016/1.356 ≈ 16.5 MS/m,
    // inside the zinc's own window (physics.md: the reading tends to Σσd/Σd); within 1 % at 100 Hz,
    // where the zinc is still a few tenths of a skin depth thick (tolerance: the smallest that passes, rounded up).
    expect(low!.overlaps).toHaveLength(1);
    const mean = (16 * 1.34 + 58 * 0.016) * (MS / 1.356);
    expect(Math.abs(low!.windows[0]!.lowSPerM / mean - 1)).toBeLessThan(0.01);
    // δ ≈ plating: the copper face dominates, the windows are far apart.
    expect(high!.overlaps).toEqual([]);
    expect(high!.windows[0]!.lowSPerM).toBeGreaterThan(2 * high!.windows[1]!.highSPerM);
    expect(result.recommendedFrequencyHz).toBe(fPlating);
  });

  it("a solid alloy's window at low frequency is its table range (interval, one lift-off, 20 °C)", () => {
    // The reference plate of the piece's own thickness reads a homogeneous piece exactly
    // (physics.md, apparent conductivity); corners of the range are the range.
    const result = evaluateSortPlan(
      plan({
        frequenciesHz: [50],
        materials: [material('brass', 15.6 * MS, 16.8 * MS)],
        products: [{ name: 'brass', layers: [{ material: 0, thicknessM: 2 * mm }] }],
      }),
    );
    const w = result.frequencies[0]!.windows[0]!;
    expect(w.lowSPerM / (15.6 * MS)).toBeCloseTo(1, 5);
    expect(w.highSPerM / (16.8 * MS)).toBeCloseTo(1, 5);
  });

  it('temperature lowers a window through the coefficient: σ(T) = σ20/(1 + α·ΔT)', () => {
    // IEC 60028: α20 of annealed copper 0.00393 /K (physics.md).
    const result = evaluateSortPlan(
      plan({
        frequenciesHz: [50],
        temperatureK: { min: 313.15, max: 313.15 },
        materials: [material('copper', 58 * MS, 58 * MS, 0.00393)],
        products: [{ name: 'cu', layers: [{ material: 0, thicknessM: null }] }],
      }),
    );
    expect(
      result.frequencies[0]!.windows[0]!.lowSPerM / ((58 * MS) / (1 + 0.00393 * 20)),
    ).toBeCloseTo(1, 5);
  });
});

describe("the plan's kernel against Layer Lab's", () => {
  it('reads a plated coin within 2e-5 of Layer Lab at every frequency', () => {
    // Layer Lab's kernel agrees with SciPy to ~1e-11 (tests/fixtures/physics); the plan's
    // coarser quadrature is allowed 2e-5 of the reading (the smallest round bound that passes:
    // table ranges are percent wide).
    const layers = [
      { conductivitySPerM: 58 * MS, relativePermeability: 1, thicknessM: 8 * um },
      { conductivitySPerM: 16.4 * MS, relativePermeability: 1, thicknessM: 1.34 * mm },
      { conductivitySPerM: 58 * MS, relativePermeability: 1, thicknessM: 8 * um },
    ];
    const frequenciesHz = [100, 1e3, 1e4, 1e5, 1e6, 1e7];
    for (const liftOff of [0.1 * mm, 0.5 * mm, 2 * mm]) {
      const lab = apparentConductivitySweep(
        buildDoddDeedsKernel(COIL, liftOff),
        layers,
        frequenciesHz,
      );
      const result = evaluateSortPlan(
        plan({
          frequenciesHz,
          liftOffM: { min: liftOff, max: liftOff },
          materials: [material('copper', 58 * MS, 58 * MS), material('zinc', 16.4 * MS, 16.4 * MS)],
          products: [
            {
              name: 'plated',
              layers: [
                { material: 0, thicknessM: 8 * um },
                { material: 1, thicknessM: 1.34 * mm },
                { material: 0, thicknessM: 8 * um },
              ],
            },
          ],
        }),
      );
      result.frequencies.forEach((f, i) => {
        const expected = lab[i]!.apparentConductivitySPerM;
        expect(
          Math.abs(f.windows[0]!.lowSPerM / expected - 1),
          `${f.frequencyHz} Hz, ${liftOff} m`,
        ).toBeLessThan(2e-5);
      });
    }
  });
});

describe('Monte Carlo', () => {
  const input = plan({
    liftOffM: { min: 0.4 * mm, max: 0.6 * mm },
    temperatureK: { min: 288.15, max: 308.15 },
    platingTolerance: 0.1,
    materials: [
      material('copper', 58 * MS, 58.9 * MS, 0.00393),
      material('zinc', 16 * MS, 16.8 * MS, 0.0037),
    ],
    products: [
      {
        name: 'plated',
        layers: [
          { material: 0, thicknessM: 8 * um },
          { material: 1, thicknessM: 1.34 * mm },
          { material: 0, thicknessM: 8 * um },
        ],
      },
      { name: 'zinc', layers: [{ material: 1, thicknessM: 1.356 * mm }] },
    ],
    method: { kind: 'monteCarlo', samples: 64, seed: 11 },
  });

  it('the same seed gives the same answer, another seed another one', () => {
    const a = evaluateSortPlan(input);
    expect(evaluateSortPlan(input)).toEqual(a);
    expect(
      evaluateSortPlan({ ...input, method: { kind: 'monteCarlo', samples: 64, seed: 12 } }),
    ).not.toEqual(a);
  });

  it('sampled windows lie inside the interval windows when the reading is monotone', () => {
    // Uniform samples inside the box can only reach its corners (monotone case, physics.md).
    const mc = evaluateSortPlan(input);
    const box = evaluateSortPlan({ ...input, method: { kind: 'interval' } });
    expect(box.warnings.filter((w) => w.code === 'non-monotone')).toEqual([]);
    mc.frequencies.forEach((f, i) =>
      f.windows.forEach((w, p) => {
        const b = box.frequencies[i]!.windows[p]!;
        expect(w.lowSPerM).toBeGreaterThanOrEqual(b.lowSPerM * (1 - 1e-6));
        expect(w.highSPerM).toBeLessThanOrEqual(b.highSPerM * (1 + 1e-6));
      }),
    );
  });

  it('the generator is uniform in the mean: 10,000 draws average 0.5 ± 0.01', () => {
    // The mean of n uniform draws has standard deviation 1/√(12n) ≈ 0.0029 (arithmetic).
    const next = seededUniform(1);
    let sum = 0;
    for (let i = 0; i < 10_000; i++) sum += next();
    expect(Math.abs(sum / 10_000 - 0.5)).toBeLessThan(0.01);
  });
});
