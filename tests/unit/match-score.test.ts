import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createAlloyRepository } from '../../backend/db/alloy-repository';
import { matchReading } from '../../backend/services/match';
import type { AlloyRecord } from '../../shared/catalogue/alloy-record';
import { scoreCandidate, UNCORRECTED_WEIGHT } from '../../shared/match/score';
import { baseMetalsFrom, estimateAlpha } from '../../shared/match/temperature-estimate';
import { createTestDatabase } from '../helpers/test-app';
import type { Knex } from 'knex';

const iacs = (p: number) => p * 0.58e6;
const source = {
  id: 1,
  citation: 'test values, invented for the scoring logic',
  kind: 'handbook' as const,
  locator: null,
  url: null,
};

/** A made-up alloy for exercising the scoring rules only. */
function alloy(
  overrides: Partial<AlloyRecord> & { sigma: [number, number, number]; alpha?: number },
): AlloyRecord {
  const [n, lo, hi] = overrides.sigma;
  const values: AlloyRecord['values'] = [
    {
      quantity: 'conductivity',
      nominal: n,
      min: lo,
      max: hi,
      unit: 'S/m',
      referenceTemperatureK: 293.15,
      condition: null,
      source,
    },
    {
      quantity: 'density',
      nominal: 8530,
      min: 8500,
      max: 8550,
      unit: 'kg/m3',
      referenceTemperatureK: 293.15,
      condition: null,
      source,
    },
  ];
  if (overrides.alpha !== undefined) {
    values.push({
      quantity: 'resistivity_temperature_coefficient',
      nominal: overrides.alpha,
      min: null,
      max: null,
      unit: '1/K',
      referenceTemperatureK: 293.15,
      condition: null,
      source,
    });
  }
  return {
    id: 1,
    slug: 'test-alloy',
    name: 'Test alloy',
    family: 'copper-zinc',
    uns: null,
    magnetic: false,
    relativePermeability: 1,
    composition: {},
    condition: null,
    notes: null,
    status: 'published',
    values,
    ...overrides,
  };
}

describe('scoreCandidate', () => {
  const brassLike = alloy({ sigma: [iacs(28), iacs(27), iacs(29)], alpha: 0.0011 });

  it('gives the top score to a reading at the nominal, and says it lies inside the range', () => {
    const result = scoreCandidate(
      { conductivitySPerM: iacs(28), uncertaintyPercent: 2 },
      brassLike,
    )!;
    expect(result.score).toBeCloseTo(1, 6);
    expect(result.reasons).toContain('28.0 %IACS at 20 °C lies inside 27.0–29.0 %IACS');
  });

  it('scores readings further outside the range lower, monotonically', () => {
    const scores = [29, 29.5, 30, 31, 33].map(
      (p) =>
        scoreCandidate({ conductivitySPerM: iacs(p), uncertaintyPercent: 2 }, brassLike)!.score,
    );
    for (let i = 1; i < scores.length; i++) expect(scores[i]!).toBeLessThan(scores[i - 1]!);
    expect(scores.at(-1)!).toBeLessThan(0.01);
  });

  it('corrects a warm reading to 20 °C with the alloy coefficient and says so', () => {
    // Read at 40 °C: σ40 = σ20 / (1 + 0.0011·20), so the corrected value returns to 28.0 %IACS.
    const warm = iacs(28) / (1 + 0.0011 * 20);
    const result = scoreCandidate(
      { conductivitySPerM: warm, temperatureK: 313.15, uncertaintyPercent: 2 },
      brassLike,
    )!;
    expect(result.correctedConductivitySPerM).toBeCloseTo(iacs(28), 0);
    expect(result.reasons[0]).toBe(
      '27.4 %IACS read at 40 °C corrects to 28.0 %IACS at 20 °C (α = 0.00110 /K)',
    );
  });

  it('says when it cannot correct because no coefficient is on record', () => {
    const noAlpha = alloy({ sigma: [iacs(28), iacs(27), iacs(29)] });
    const result = scoreCandidate(
      { conductivitySPerM: iacs(28), temperatureK: 308.15, uncertaintyPercent: 2 },
      noAlpha,
    )!;
    expect(result.reasons[0]).toMatch(/no temperature coefficient on record/);
  });

  it('lowers the score when the density disagrees', () => {
    const good = scoreCandidate(
      { conductivitySPerM: iacs(28), densityKgPerM3: 8530, uncertaintyPercent: 2 },
      brassLike,
    )!;
    const bad = scoreCandidate(
      { conductivitySPerM: iacs(28), densityKgPerM3: 7140, uncertaintyPercent: 2 },
      brassLike,
    )!;
    expect(good.reasons).toContain('density 8.53 g/cm³ matches 8.53 g/cm³');
    expect(bad.score).toBeLessThan(0.01);
  });

  it('marks a magnetic candidate in its reasons', () => {
    const steel = alloy({ sigma: [7e6, 6.3e6, 7.7e6], magnetic: true });
    const result = scoreCandidate({ conductivitySPerM: 7e6, uncertaintyPercent: 2 }, steel)!;
    expect(result.reasons.at(-1)).toMatch(/^magnetic:/);
  });
});

describe('matchReading on the seeded table', () => {
  let knex: Knex;
  let alloys: AlloyRecord[];
  beforeAll(async () => {
    knex = await createTestDatabase();
    alloys = await createAlloyRepository(knex).listPublished();
  });
  afterAll(() => knex.destroy());

  it('puts C26000 in the first three for a cartridge-brass reading (28 %IACS, 8.53 g/cm³: CDA and mill data)', () => {
    const ranked = matchReading(
      alloys,
      { conductivitySPerM: iacs(28), densityKgPerM3: 8530, uncertaintyPercent: 2 },
      10,
    );
    expect(ranked.slice(0, 3).map((c) => c.uns)).toContain('C26000');
    for (let i = 1; i < ranked.length; i++)
      expect(ranked[i]!.score).toBeLessThanOrEqual(ranked[i - 1]!.score);
  });

  it('finds annealed copper for 100 %IACS (IEC 60028 defines it)', () => {
    const ranked = matchReading(alloys, { conductivitySPerM: iacs(100), uncertaintyPercent: 1 }, 3);
    expect(ranked.map((c) => c.uns)).toEqual(expect.arrayContaining(['C11000']));
  });

  it('returns nothing for a reading no metal gives', () => {
    expect(
      matchReading(alloys, { conductivitySPerM: iacs(500), uncertaintyPercent: 2 }, 10),
    ).toEqual([]);
  });
});

describe("temperature coefficients estimated by Matthiessen's rule", () => {
  const base = {
    element: 'Cu',
    resistivityOhmM: 1 / iacs(100),
    alphaPerK: 0.00393,
    from: 'copper',
  };

  it('α_alloy = α_base·ρ_base/ρ_alloy, bounded above by 1.5× and by the base metal', () => {
    // Copper α20 = 0.00393 /K (IEC 60028); a 25 %IACS alloy: 0.00393 × 25 / 100 (arithmetic).
    const e = estimateAlpha(1 / iacs(25), base);
    expect(e.alphaPerK).toBeCloseTo(0.0009825, 9);
    expect(e.highPerK).toBeCloseTo(1.5 * 0.0009825, 7);
    // A nearly pure metal cannot exceed its base's own α.
    expect(estimateAlpha(1 / iacs(95), base).highPerK).toBe(0.00393);
  });

  it('an alloy with no coefficient is estimated from its main element; with no base, halved', () => {
    const noAlpha = alloy({
      sigma: [iacs(28), iacs(27), iacs(29)],
      composition: { Cu: 70, Zn: 30 },
    });
    const warm = { conductivitySPerM: iacs(26.8), temperatureK: 333.15, uncertaintyPercent: 2 };
    const bases = new Map([['Cu', base]]);
    const estimated = scoreCandidate(warm, noAlpha, bases)!;
    expect(estimated.correction.kind).toBe('estimated');
    const none = scoreCandidate(warm, noAlpha, new Map())!;
    expect(none.correction.kind).toBe('none');
    expect(none.score).toBeLessThanOrEqual(UNCORRECTED_WEIGHT);
    expect(none.score).toBeLessThan(estimated.score);
    const recorded = scoreCandidate(warm, {
      ...noAlpha,
      ...alloy({ sigma: [iacs(28), iacs(27), iacs(29)], alpha: 0.0011 }),
    })!;
    expect(recorded.correction).toEqual({ kind: 'recorded', alphaPerK: 0.0011 });
  });

  it('base metals come from the purest row of each element that has a coefficient', () => {
    const cu = alloy({
      sigma: [iacs(101), iacs(100), iacs(101.5)],
      alpha: 0.00393,
      composition: { Cu: 99.9 },
      slug: 'cu',
    });
    const brass = alloy({
      sigma: [iacs(28), iacs(27), iacs(29)],
      alpha: 0.0011,
      composition: { Cu: 70, Zn: 30 },
    });
    const bases = baseMetalsFrom([brass, cu]);
    expect(bases.get('Cu')).toMatchObject({ from: 'cu', alphaPerK: 0.00393 });
    expect(bases.get('Ni')?.from).toMatch(/recalled/);
  });
});
