import type { Knex } from 'knex';
import { alloys as referenceAlloys } from '../seeds/reference/alloys';

/**
 * Other names an alloy goes by ("Muntz metal", "German silver", "18-8"), as a JSON array of text,
 * for search. A table seeded before this migration gets the reference aliases here, by slug,
 * because the reference seed never runs again on a table that already holds alloys.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('alloys', (t) => {
    t.text('aliases_json').notNullable().defaultTo('[]');
  });
  for (const alloy of referenceAlloys) {
    if (!alloy.aliases?.length) continue;
    await knex('alloys')
      .where({ slug: alloy.slug })
      .update({ aliases_json: JSON.stringify(alloy.aliases) });
  }
}

export async function down(knex: Knex): Promise<void> {
  // SQLite (3.35+) drops a column in place; Knex's dropColumn would rebuild the table, and with
  // foreign keys on, rebuilding `alloys` would cascade into property_values.
  await knex.raw('ALTER TABLE alloys DROP COLUMN aliases_json');
}
