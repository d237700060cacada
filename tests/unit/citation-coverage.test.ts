import { describe, expect, it } from 'vitest';
import {
  citationCoverage,
  citedValuesOf,
  type CitedValue,
} from '../../shared/catalogue/citation-coverage';
import type { AlloyRecord } from '../../shared/catalogue/alloy-record';
import { propertyRows, referenceValues } from '../../seeds/01_reference_table';
import { alloys } from '../../seeds/reference/alloys';
import { sources } from '../../seeds/reference/sources';

const value = (
  slug: string,
  quantity: CitedValue['quantity'],
  sourceId: number,
  kind: CitedValue['kind'],
): CitedValue => ({ slug, quantity, sourceId, kind });

describe('citation coverage (shared/catalogue/citation-coverage.ts)', () => {
  // Six invented values, counted by hand: 2 handbook, 1 standard, 2 from memory, 1 without a row.
  const values = [
    value('a', 'conductivity', 2, 'handbook'),
    value('a', 'density', 5, 'from_memory'),
    value('a', 'resistivity_temperature_coefficient', 1, 'standard'),
    value('b', 'conductivity', 3, 'handbook'),
    value('b', 'density', 99, null),
    value('c', 'relative_permeability', 12, 'from_memory'),
  ];
  const coverage = citationCoverage(values);

  it('counts every value, the located ones and those from memory', () => {
    expect(coverage.values).toBe(6);
    expect(coverage.cited).toBe(3);
    expect(coverage.fromMemory).toBe(2);
    expect(coverage.byKind).toEqual({
      handbook: 2,
      standard: 1,
      paper: 0,
      measurement_set: 0,
      from_memory: 2,
    });
  });

  it('counts per quantity, the four adding up to the whole', () => {
    expect(coverage.byQuantity.conductivity).toMatchObject({ values: 2, cited: 2, fromMemory: 0 });
    expect(coverage.byQuantity.density).toMatchObject({ values: 2, cited: 0, fromMemory: 1 });
    expect(coverage.byQuantity.resistivity_temperature_coefficient.byKind.standard).toBe(1);
    expect(coverage.byQuantity.relative_permeability.byKind.from_memory).toBe(1);
    const sum = Object.values(coverage.byQuantity).reduce((s, c) => s + c.values, 0);
    expect(sum).toBe(coverage.values);
  });

  it('lists the values from memory and those with no source row, in order', () => {
    expect(coverage.notLocated.map((v) => `${v.slug} ${v.quantity}`)).toEqual([
      'a density',
      'c relative_permeability',
    ]);
    expect(coverage.unsourced).toEqual([value('b', 'density', 99, null)]);
  });

  it('counts an empty table as zeros', () => {
    expect(citationCoverage([])).toMatchObject({ values: 0, cited: 0, fromMemory: 0 });
  });

  it('reads the live table’s records the same way', () => {
    const record = {
      slug: 'x',
      values: [
        {
          quantity: 'conductivity',
          source: { id: 2, citation: 'c', kind: 'handbook', locator: null, url: null },
        },
      ],
    } as unknown as AlloyRecord;
    expect(citedValuesOf([record])).toEqual([value('x', 'conductivity', 2, 'handbook')]);
  });
});

describe('the seed’s values as the report counts them', () => {
  const seeded = referenceValues();

  it('has one entry per property row the seed loads', () => {
    const rows = alloys.flatMap((a, i) => propertyRows(a, i + 1));
    expect(seeded).toHaveLength(rows.length);
  });

  it('finds a source row for every value (npm run table:report would exit 1)', () => {
    expect(citationCoverage(seeded).unsourced).toEqual([]);
  });

  it('takes each value’s kind from its source row', () => {
    const kindOf = new Map(sources.map((s) => [s.id, s.kind]));
    for (const v of seeded) expect(v.kind, `${v.slug} ${v.quantity}`).toBe(kindOf.get(v.sourceId));
  });
});
