import { describe, expect, it } from 'vitest';
import { alloys, type AlloySeed } from '../../seeds/reference/alloys';
import { sources } from '../../seeds/reference/sources';
import {
  quotedFigures,
  type QuotedFigure,
  type QuotedQuantity,
  type QuotedUnit,
} from '../../seeds/reference/quoted-figures';
import { IACS_100_S_PER_M } from '../../shared/units/conductivity';
import { citationCoverage } from '../../shared/catalogue/citation-coverage';
import { referenceValues } from '../../seeds/01_reference_table';

/**
 * Every value the table cites from a located document agrees with the figure that document prints
 * (seeds/reference/quoted-figures-*.ts), converted to SI. A seed edited without its source, or a
 * figure mistyped, fails here.
 */

/** SI conversions of the units sources print. */
const toSi: Record<QuotedUnit, (v: number) => number> = {
  '%IACS': (v) => (v / 100) * IACS_100_S_PER_M, // S/m
  'MS/m': (v) => v * 1e6,
  'uohm.cm': (v) => 1 / (v * 1e-8),
  'nohm.m': (v) => 1 / (v * 1e-9),
  // 1 Ω·cmil/ft = (π/4 · 25.4e-6² m²) / 0.3048 m = 1.66243e-9 Ω·m (definition of the circular mil)
  'ohm.cmil/ft': (v) => 1 / ((v * ((Math.PI / 4) * 25.4e-6 ** 2)) / 0.3048),
  'g/cm3': (v) => v * 1000, // kg/m³
  'kg/m3': (v) => v,
  'lb/in3': (v) => (v * 0.45359237) / 0.0254 ** 3,
  '1/K': (v) => v,
  '1/degF': (v) => v * 1.8,
  '1': (v) => v,
};

/** The seed's triple for a quantity in SI (conductivity S/m, density kg/m³). */
function seedTriple(a: AlloySeed, q: QuotedQuantity): [number, number, number] | null {
  switch (q) {
    case 'conductivity': {
      if ('iacs' in a.conductivity) {
        const [n, lo, hi] = a.conductivity.iacs.map(toSi['%IACS']);
        return [n!, lo!, hi!];
      }
      const [n, lo, hi] = a.conductivity.uohmCm.map(toSi['uohm.cm']);
      return [n!, hi!, lo!];
    }
    case 'density': {
      const [n, lo, hi] = a.densityGPerCm3.map(toSi['g/cm3']);
      return [n!, lo!, hi!];
    }
    case 'resistivity_temperature_coefficient':
      return a.alpha ? [a.alpha.value, a.alpha.value, a.alpha.value] : null;
    case 'relative_permeability':
      return a.magnetic ? [...a.magnetic.relativePermeability] : null;
  }
}

function seedSource(a: AlloySeed, q: QuotedQuantity): number | null {
  switch (q) {
    case 'conductivity':
      return a.conductivitySource;
    case 'density':
      return a.densitySource;
    case 'resistivity_temperature_coefficient':
      return a.alpha?.source ?? null;
    case 'relative_permeability':
      return a.magnetic?.source ?? null;
  }
}

const sourceById = new Map(sources.map((s) => [s.id, s]));
const alloyBySlug = new Map(alloys.map((a) => [a.slug, a]));
const label = (f: QuotedFigure) => `${f.slug} ${f.quantity} (source ${f.sourceId}, ${f.where})`;

describe('the reference table against the figures its located sources print', () => {
  it('has one source row per document, each id once', () => {
    expect(new Set(sources.map((s) => s.id)).size).toBe(sources.length);
    const texts = sources.map((s) => s.citation.trim().toLowerCase());
    expect(new Set(texts).size).toBe(texts.length);
  });

  it('gives every located source a public address and a citation naming the document', () => {
    for (const s of sources.filter((s) => s.kind !== 'from_memory' && s.id >= 100)) {
      expect(s.url, `source ${s.id}`).toMatch(/^https:\/\//);
      expect(s.citation.length, `source ${s.id}`).toBeGreaterThan(20);
    }
  });

  it.each(quotedFigures.map((f) => [label(f), f] as const))('%s', (_, f) => {
    const alloy = alloyBySlug.get(f.slug);
    expect(alloy, 'an alloy of the table').toBeDefined();
    const source = sourceById.get(f.sourceId);
    expect(source, 'a source row').toBeDefined();
    expect(source!.kind).not.toBe('from_memory');
    expect(seedSource(alloy!, f.quantity), 'the seed cites this source for it').toBe(f.sourceId);
    const [nominal, min, max] = seedTriple(alloy!, f.quantity)!;
    const figure = toSi[f.unit](f.value);
    const tolerance = f.tolerance ?? 0.01;
    if (tolerance > 0.01) expect(f.note, 'a wider tolerance says why').toBeTruthy();
    expect(Math.abs(nominal - figure) / figure).toBeLessThanOrEqual(tolerance);
    expect(figure).toBeGreaterThanOrEqual(min * (1 - 1e-9));
    expect(figure).toBeLessThanOrEqual(max * (1 + 1e-9));
  });

  it('quotes a figure for every value that cites a located source', () => {
    const quantities: QuotedQuantity[] = [
      'conductivity',
      'density',
      'resistivity_temperature_coefficient',
      'relative_permeability',
    ];
    const missing: string[] = [];
    for (const a of alloys) {
      for (const q of quantities) {
        const id = seedSource(a, q);
        if (id === null || sourceById.get(id)?.kind === 'from_memory') continue;
        if (id === 1) continue; // the IACS definition itself: 100 %IACS is exact by definition
        const quoted = quotedFigures.some(
          (f) => f.slug === a.slug && f.quantity === q && f.sourceId === id,
        );
        if (!quoted) missing.push(`${a.slug} ${q} (source ${id})`);
      }
    }
    expect(missing).toEqual([]);
  });
});

describe("the table's coverage (issue 11)", () => {
  it('holds at least 100 metals and alloys', () => {
    expect(alloys.length).toBeGreaterThanOrEqual(100);
  });

  it('cites a located source for at least 90 % of its values', () => {
    const coverage = citationCoverage(referenceValues());
    expect(coverage.cited / coverage.values).toBeGreaterThanOrEqual(0.9);
  });

  it('keeps no source row that no value cites', () => {
    const cited = new Set(referenceValues().map((v) => v.sourceId));
    const unused = sources.filter((s) => !cited.has(s.id)).map((s) => s.id);
    expect(unused).toEqual([]);
  });
});
