import type { Knex } from 'knex';
import type { CitedValue } from '../shared/catalogue/citation-coverage';
import type { QuantityName } from '../shared/catalogue/alloy-record';
import { IACS_100_S_PER_M } from '../shared/units/conductivity';
import { ROOM_TEMPERATURE_K } from '../shared/units/temperature';
import { alloys, type AlloySeed, type Triple } from './reference/alloys';
import { quotedFigures } from './reference/quoted-figures';
import { quotedLineFor } from './reference/quoted-line';
import { sources } from './reference/sources';

/** Conductivity triple in S/m; a resistivity maximum is the conductivity minimum. */
function conductivityTriple(seed: AlloySeed): Triple {
  if ('iacs' in seed.conductivity) {
    const [n, lo, hi] = seed.conductivity.iacs;
    return [
      (n * IACS_100_S_PER_M) / 100,
      (lo * IACS_100_S_PER_M) / 100,
      (hi * IACS_100_S_PER_M) / 100,
    ];
  }
  const [n, lo, hi] = seed.conductivity.uohmCm;
  return [1 / (n * 1e-8), 1 / (hi * 1e-8), 1 / (lo * 1e-8)];
}

interface PropertyRow {
  alloy_id: number;
  quantity: QuantityName;
  nominal: number;
  min: number | null;
  max: number | null;
  unit: string;
  reference_temperature_k: number;
  condition: string | null;
  source_id: number;
  /** What the located source prints for this value (reference/quoted-line.ts), or null. */
  quoted: string | null;
}

/** Rows of property_values for one alloy, SI inside. */
export function propertyRows(seed: AlloySeed, alloyId: number): PropertyRow[] {
  const base = {
    alloy_id: alloyId,
    reference_temperature_k: ROOM_TEMPERATURE_K,
    condition: seed.condition,
  };
  const [cn, cmin, cmax] = conductivityTriple(seed);
  const [dn, dmin, dmax] = seed.densityGPerCm3;
  const rows: Array<Omit<PropertyRow, 'quoted'>> = [
    {
      ...base,
      quantity: 'conductivity',
      nominal: cn,
      min: cmin,
      max: cmax,
      unit: 'S/m',
      source_id: seed.conductivitySource,
    },
    {
      ...base,
      quantity: 'density',
      nominal: dn * 1000,
      min: dmin * 1000,
      max: dmax * 1000,
      unit: 'kg/m3',
      source_id: seed.densitySource,
    },
  ];
  if (seed.alpha) {
    rows.push({
      ...base,
      quantity: 'resistivity_temperature_coefficient',
      nominal: seed.alpha.value,
      min: null,
      max: null,
      unit: '1/K',
      source_id: seed.alpha.source,
    });
  }
  if (seed.magnetic) {
    const [mn, mmin, mmax] = seed.magnetic.relativePermeability;
    rows.push({
      ...base,
      quantity: 'relative_permeability',
      nominal: mn,
      min: mmin,
      max: mmax,
      unit: '1',
      source_id: seed.magnetic.source,
    });
  }
  return rows.map((row) => ({
    ...row,
    quoted: quotedLineFor(quotedFigures, seed.slug, row.quantity, row.source_id),
  }));
}

/**
 * Every value the seed loads, with the kind of its source (null when the id has no source row),
 * for `npm run table:report` and the tests; read from the seed data, no database needed.
 */
export function referenceValues(): CitedValue[] {
  const kindOf = new Map(sources.map((s) => [s.id, s.kind]));
  return alloys.flatMap((a, index) =>
    propertyRows(a, index + 1).map((row) => ({
      slug: a.slug,
      quantity: row.quantity,
      sourceId: row.source_id,
      kind: kindOf.get(row.source_id) ?? null,
    })),
  );
}

/** Resets the reference table (sources, alloys, values) and loads it with explicit ids. */
export async function seed(knex: Knex): Promise<void> {
  await knex.transaction(async (trx) => {
    await trx('property_values').del();
    await trx('alloys').del();
    await trx('sources').del();
    await trx('sources').insert(sources);
    let valueId = 1;
    for (const [index, a] of alloys.entries()) {
      const id = index + 1;
      await trx('alloys').insert({
        id,
        slug: a.slug,
        name: a.name,
        family: a.family,
        uns: a.uns,
        magnetic: a.magnetic !== undefined,
        relative_permeability: a.magnetic ? a.magnetic.relativePermeability[0] : 1,
        composition_json: JSON.stringify(a.composition),
        aliases_json: JSON.stringify(a.aliases ?? []),
        condition: a.condition,
        notes: a.notes ?? null,
        status: 'published',
      });
      const rows = propertyRows(a, id).map((row) => ({ ...row, id: valueId++ }));
      await trx('property_values').insert(rows);
    }
  });
}
