import type { Knex } from 'knex';
import { IACS_100_S_PER_M } from '../shared/units/conductivity';
import { ROOM_TEMPERATURE_K } from '../shared/units/temperature';
import { alloys, type AlloySeed, type Triple } from './reference/alloys';
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
  quantity: string;
  nominal: number;
  min: number | null;
  max: number | null;
  unit: string;
  reference_temperature_k: number;
  condition: string | null;
  source_id: number;
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
  const rows: PropertyRow[] = [
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
  return rows;
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
