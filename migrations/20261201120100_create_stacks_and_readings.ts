import type { Knex } from 'knex';

/** Built-in stacks (blanks as layers) and recorded readings, both used by the demo scenario. */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('stacks', (t) => {
    t.integer('id').primary();
    t.text('slug').notNullable().unique();
    t.text('name').notNullable();
    t.text('description');
    t.double('diameter_m').notNullable();
    // Layers from the face toward the coil downward: [{ alloy, thicknessM }]
    t.text('layers_json').notNullable();
    t.double('mass_kg');
    t.boolean('built_in').notNullable().defaultTo(false);
    t.boolean('invented').notNullable().defaultTo(false);
  });
  await knex.schema.createTable('readings', (t) => {
    t.integer('id').primary();
    t.text('label').notNullable();
    t.text('site').notNullable();
    t.text('product').notNullable();
    t.double('conductivity_s_per_m').notNullable();
    t.double('frequency_hz');
    t.double('temperature_k').notNullable();
    t.double('density_kg_per_m3');
    t.double('mass_kg');
    t.boolean('invented').notNullable().defaultTo(false);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('readings');
  await knex.schema.dropTable('stacks');
}
