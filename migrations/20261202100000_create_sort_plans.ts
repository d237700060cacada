import type { Knex } from 'knex';

/**
 * Saved sort plans, each owned by the person who saved it: the request as sent, the release it
 * was evaluated against and the result with its SHA-256, so that an export is the same bytes
 * every time and a later release can be compared with it.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('sort_plans', (t) => {
    t.increments('id');
    t.integer('owner_id').notNullable().references('id').inTable('users').onDelete('CASCADE');
    t.text('name').notNullable();
    t.text('inputs_json').notNullable();
    t.text('release_version').notNullable();
    t.text('release_checksum').notNullable();
    t.text('result_json').notNullable();
    t.text('result_sha256').notNullable();
    t.text('created_at').notNullable();
    t.index(['owner_id']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('sort_plans');
}
