import type { Knex } from 'knex';

/**
 * State that several instances on one PostgreSQL database must share: rate-limit counters (one
 * fixed window per key; backend/http/knex-rate-limit-store.ts) and the catalogue's version, which
 * an approval bumps so every instance rebuilds its in-memory catalogue. On SQLite one process
 * keeps both in memory, and the tables stay empty.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('rate_limits', (t) => {
    t.text('key').primary();
    t.integer('hits').notNullable();
    // Milliseconds since 1970 when the window ends.
    t.bigInteger('reset_at').notNullable();
    t.index(['reset_at']);
  });
  await knex.schema.createTable('catalogue_version', (t) => {
    t.integer('id').primary();
    t.integer('version').notNullable();
  });
  await knex('catalogue_version').insert({ id: 1, version: 0 });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('catalogue_version');
  await knex.schema.dropTable('rate_limits');
}
