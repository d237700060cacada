import type { Knex } from 'knex';
import { quotedFigures } from '../seeds/reference/quoted-figures';
import { quotedLineFor } from '../seeds/reference/quoted-line';
import { sources } from '../seeds/reference/sources';

/**
 * What the located source prints for each value ("Table 2: 28 %IACS at 20 °C (annealed)"), as a
 * nullable line beside the value; a value a curator changed, or one from memory, has none.
 * A table seeded before this migration gets the quotes here, for the values that still cite the
 * same document (same id and citation): the reference seed never runs again on a table that
 * already holds alloys.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('property_values', (t) => {
    t.text('quoted');
  });
  const citationOf = new Map(sources.map((s) => [s.id, s.citation]));
  const rows = (await knex('property_values as v')
    .join('alloys as a', 'a.id', 'v.alloy_id')
    .join('sources as s', 's.id', 'v.source_id')
    .select('v.id', 'a.slug', 'v.quantity', 'v.source_id', 's.citation')) as Array<{
    id: number;
    slug: string;
    quantity: string;
    source_id: number;
    citation: string;
  }>;
  for (const row of rows) {
    if (citationOf.get(row.source_id) !== row.citation) continue;
    const quoted = quotedLineFor(quotedFigures, row.slug, row.quantity, row.source_id);
    if (quoted) await knex('property_values').where({ id: row.id }).update({ quoted });
  }
}

export async function down(knex: Knex): Promise<void> {
  // In place (SQLite 3.35+): Knex's dropColumn rebuilds the table (see add_alloy_aliases).
  await knex.raw('ALTER TABLE property_values DROP COLUMN quoted');
}
