import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Knex } from 'knex';
import elementsFixture from '../fixtures/pymatgen/elements.json';
import { createAlloyRepository } from '../../backend/db/alloy-repository';
import { valueOf, type AlloyRecord } from '../../shared/catalogue/alloy-record';
import { percentIacs } from '../../shared/units/conductivity';
import { createTestDatabase } from '../helpers/test-app';

let knex: Knex;
let alloys: AlloyRecord[];
const bySlug = (slug: string) => {
  const alloy = alloys.find((a) => a.slug === slug);
  if (!alloy) throw new Error(`no alloy ${slug} in the seed`);
  return alloy;
};
const iacsOf = (slug: string) => percentIacs(valueOf(bySlug(slug), 'conductivity')!.nominal);
const gPerCm3Of = (slug: string) => valueOf(bySlug(slug), 'density')!.nominal / 1000;

beforeAll(async () => {
  knex = await createTestDatabase();
  alloys = await createAlloyRepository(knex).listPublished();
});
afterAll(() => knex.destroy());

describe('the reference table as a whole', () => {
  it('holds at least 45 metals and alloys, each with a conductivity and a density', () => {
    expect(alloys.length).toBeGreaterThanOrEqual(45);
    for (const a of alloys) {
      expect(valueOf(a, 'conductivity'), a.slug).toBeDefined();
      expect(valueOf(a, 'density'), a.slug).toBeDefined();
    }
  });

  it('gives every value a source, a reference temperature and min ≤ nominal ≤ max', () => {
    for (const a of alloys) {
      for (const v of a.values) {
        expect(v.source.citation.length, `${a.slug} ${v.quantity}`).toBeGreaterThan(10);
        expect(v.referenceTemperatureK).toBeCloseTo(293.15, 6);
        if (v.min !== null)
          expect(v.min, `${a.slug} ${v.quantity} min`).toBeLessThanOrEqual(v.nominal);
        if (v.max !== null)
          expect(v.max, `${a.slug} ${v.quantity} max`).toBeGreaterThanOrEqual(v.nominal);
      }
    }
  });

  it('marks every citation that was not re-checked as from memory, and says so in its text', () => {
    const kinds = new Set(alloys.flatMap((a) => a.values.map((v) => v.source.kind)));
    expect(kinds).toContain('from_memory');
    for (const v of alloys.flatMap((a) => a.values)) {
      if (v.source.kind === 'from_memory') expect(v.source.citation).toMatch(/recalled/);
    }
  });

  it('stores a temperature coefficient only where a source gives one (Match estimates the rest)', () => {
    const withAlpha = alloys.filter((a) => valueOf(a, 'resistivity_temperature_coefficient'));
    expect(withAlpha.length).toBeGreaterThanOrEqual(15);
    for (const a of withAlpha) {
      const v = valueOf(a, 'resistivity_temperature_coefficient')!;
      expect(v.source.kind, a.slug).not.toBe('from_memory');
    }
  });

  it('has every alloy the demo scenario needs', () => {
    for (const slug of [
      'zinc-coinage-strip',
      'steel-1008',
      'nickel-brass-coinage',
      'gilding-metal-c21000',
      'cupronickel-75-25-c71300',
      'copper-c11000',
      'aluminium-6063-t6',
      'free-cutting-brass-c36000',
      'zinc-alloy-3',
      'stainless-304',
      'lead',
    ]) {
      expect(() => bySlug(slug)).not.toThrow();
    }
  });
});

/**
 * Spot checks: each seeded nominal against the figure of the source named beside it. "physics.md"
 * is our design note's table, itself from memory of the ASM and CDA data sheets where it says ≈;
 * the located ones are the CDA design guide, IEC 60028 and published mill data sheets.
 */
describe('spot checks against cited figures', () => {
  // [slug, expected %IACS, relative tolerance, source]
  const conductivity: Array<[string, number, number, string]> = [
    [
      'copper-c11000',
      101,
      0.01,
      'physics.md [L]: annealed C11000 100–101.5 %IACS; IEC 60028 puts 100 % at annealed copper',
    ],
    [
      'cartridge-brass-c26000',
      28,
      0.001,
      'CDA Copper design guide: C26000 28 %IACS at 68 °F (located)',
    ],
    [
      'cupronickel-90-10-c70600',
      9.0,
      0.001,
      'mill data sheet C70600: 9.0 %IACS annealed (located)',
    ],
    [
      'cupronickel-70-30-c71500',
      4.6,
      0.001,
      'mill data sheet C71500: 4.6 %IACS annealed (located)',
    ],
    [
      'aluminium-6061-t6',
      43,
      0.001,
      'Aluminum Association typical via mill data sheet: 6061-T6 43 %IACS (located)',
    ],
    ['gilding-metal-c21000', 56, 0.02, 'physics.md: C21000 ≈ 56 %IACS (from memory of CDA data)'],
    ['red-brass-c23000', 37, 0.02, 'physics.md: C23000 ≈ 37 %IACS (from memory of CDA data)'],
    ['phosphor-bronze-c51000', 15, 0.02, 'physics.md: C51000 ≈ 15 %IACS (from memory)'],
    ['nickel-silver-c75200', 6, 0.05, 'physics.md: C75200 ≈ 6 %IACS (from memory)'],
    ['stainless-304', 2.4, 0.03, 'physics.md: S30400 ≈ 2.4 %IACS (from memory)'],
    ['stainless-430', 2.9, 0.03, 'physics.md: S43000 ≈ 2.9 %IACS (from memory)'],
    ['aluminium-1100-o', 59, 0.02, 'physics.md: A91100 ≈ 59 %IACS (from memory)'],
    ['aluminium-1199', 64.5, 0.01, 'physics.md: aluminium 99.99 64–65 %IACS'],
    ['zinc-shg', 28.95, 0.01, 'physics.md: zinc 28.7–29.2 %IACS'],
    ['silver-fine', 107, 0.015, 'physics.md: silver 106–108 %IACS'],
    ['gold-fine', 77, 0.015, 'physics.md: gold ≈ 76–78 %IACS'],
  ];
  it.each(conductivity)(
    '%s conductivity ≈ %d %%IACS within %d (%s)',
    (slug, expected, tolerance) => {
      const actual = iacsOf(slug);
      expect(
        Math.abs(actual - expected) / expected,
        `${slug}: ${actual} vs ${expected}`,
      ).toBeLessThanOrEqual(tolerance);
    },
  );

  it('C71300 cupronickel 75/25 lies in 4.6–5.6 %IACS (physics.md, from memory)', () => {
    const c = valueOf(bySlug('cupronickel-75-25-c71300'), 'conductivity')!;
    expect(percentIacs(c.nominal)).toBeGreaterThanOrEqual(4.6);
    expect(percentIacs(c.nominal)).toBeLessThanOrEqual(5.6);
  });

  it('nickel 200 lies in 18–25 %IACS and is magnetic (physics.md)', () => {
    expect(iacsOf('nickel-200')).toBeGreaterThanOrEqual(18);
    expect(iacsOf('nickel-200')).toBeLessThanOrEqual(25);
    expect(bySlug('nickel-200').magnetic).toBe(true);
  });

  // [slug, expected g/cm³, absolute tolerance, source]
  const density: Array<[string, number, number, string]> = [
    [
      'cartridge-brass-c26000',
      8.53,
      0.005,
      'mill data sheets: 0.308 lb/in³ = 8.53 g/cm³ (located)',
    ],
    ['cupronickel-90-10-c70600', 8.94, 0.005, 'mill data sheet C70600: 8.94 g/cm³ (located)'],
    ['aluminium-6061-t6', 2.7, 0.005, 'Aluminum Association typical: 2.70 g/cm³ (located)'],
    ['copper-c11000', 8.9, 0.03, 'physics.md [L]: 8.89–8.94 g/cm³'],
    ['stainless-304', 8.0, 0.02, 'physics.md: 8.00 g/cm³'],
    ['stainless-430', 7.75, 0.02, 'physics.md: 7.75 g/cm³'],
    ['nickel-silver-c75200', 8.73, 0.02, 'physics.md: 8.73 g/cm³'],
  ];
  it.each(density)('%s density ≈ %d g/cm³ (%s)', (slug, expected, tolerance) => {
    expect(Math.abs(gPerCm3Of(slug) - expected)).toBeLessThanOrEqual(tolerance);
  });

  it('marks the ferritic and carbon steels magnetic and the austenitic one not (physics.md)', () => {
    expect(bySlug('stainless-430').magnetic).toBe(true);
    expect(bySlug('steel-1008').magnetic).toBe(true);
    expect(bySlug('stainless-304').magnetic).toBe(false);
    expect(bySlug('cupronickel-75-25-c71300').magnetic).toBe(false);
  });

  it('uses α20 = 0.00393 /K for annealed copper (IEC 60028)', () => {
    expect(valueOf(bySlug('copper-c11000'), 'resistivity_temperature_coefficient')!.nominal).toBe(
      0.00393,
    );
  });
});

/**
 * Element values against an independent open dataset: pymatgen's periodic_table.json (MIT),
 * extracted by tests/fixtures/pymatgen/extract_elements.py. Its figures are rounded (stack.md:
 * to about 5 %), so the tolerance is 5 % plus half a unit in the last digit it shows, and twice
 * that where it says "about".
 */
describe('element values against pymatgen periodic_table.json', () => {
  const elementSlugs: Record<string, string> = {
    Ag: 'silver-fine',
    Au: 'gold-fine',
    Pt: 'platinum',
    Pd: 'palladium',
    Al: 'aluminium-1199',
    Zn: 'zinc-shg',
    Sn: 'tin',
    Pb: 'lead',
    Fe: 'iron-pure',
    Ti: 'titanium-pure',
    Mg: 'magnesium-pure',
    W: 'tungsten',
    Mo: 'molybdenum',
    Co: 'cobalt',
    Cu: 'copper-c10200',
  };
  type Entry = (typeof elementsFixture.elements)['Ag'];
  const rounding = (value: number, digits: number) =>
    (0.5 * 10 ** (Math.floor(Math.log10(value)) - digits + 1)) / value;

  it.each(Object.entries(elementSlugs))('%s (%s) resistivity and density', (symbol, slug) => {
    const ref = (elementsFixture.elements as Record<string, Entry>)[symbol]!;
    const rhoOurs = 1 / valueOf(bySlug(slug), 'conductivity')!.nominal;
    const rhoTolerance =
      (0.05 + rounding(ref.resistivityOhmM, ref.resistivitySignificantDigits)) *
      (ref.resistivityAbout ? 2 : 1);
    const rhoError = Math.abs(rhoOurs - ref.resistivityOhmM) / ref.resistivityOhmM;
    expect(
      rhoError,
      `${symbol}: ours ${rhoOurs} Ω·m, pymatgen ${ref.raw.resistivity}`,
    ).toBeLessThanOrEqual(rhoTolerance);
    const densityOurs = valueOf(bySlug(slug), 'density')!.nominal;
    const densityError = Math.abs(densityOurs - ref.densityKgPerM3) / ref.densityKgPerM3;
    expect(
      densityError,
      `${symbol}: ours ${densityOurs}, pymatgen ${ref.raw.density}`,
    ).toBeLessThanOrEqual(0.05);
  });
});
