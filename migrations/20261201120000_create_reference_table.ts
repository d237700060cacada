import type { Knex } from 'knex';

/** Sources, alloys and their property values: the cited reference table, SI values inside. */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('sources', (t) => {
    t.integer('id').primary();
    t.text('citation').notNullable();
    t.text('kind').notNullable();
    t.text('locator');
    t.text('url');
  });
  await knex.schema.createTable('alloys', (t) => {
    t.integer('id').primary();
    t.text('slug').notNullable().unique();
    t.text('name').notNullable();
    t.text('family').notNullable();
    t.text('uns');
    t.boolean('magnetic').notNullable().defaultTo(false);
    t.double('relative_permeability').notNullable().defaultTo(1);
    t.text('composition_json').notNullable().defaultTo('{}');
    t.text('condition');
    t.text('notes');
    t.text('status').notNullable().defaultTo('published');
  });
  await knex.schema.createTable('property_values', (t) => {
    t.integer('id').primary();
    t.integer('alloy_id').notNullable().references('alloys.id').onDelete('CASCADE');
    t.text('quantity').notNullable();
    t.double('nominal').notNullable();
    t.double('min');
    t.double('max');
    t.text('unit').notNullable();
    t.double('reference_temperature_k').notNullable();
    t.text('condition');
    t.integer('source_id').notNullable().references('sources.id');
    t.index(['alloy_id', 'quantity']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('property_values');
  await knex.schema.dropTable('alloys');
  await knex.schema.dropTable('sources');
}
