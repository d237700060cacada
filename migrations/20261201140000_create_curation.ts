import type { Knex } from 'knex';

/** Proposed changes and their review, the history of applied ones, measurement sets and releases. */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('revisions', (t) => {
    t.increments('id');
    t.text('kind').notNullable(); // create | edit | retire | import
    t.text('alloy_slug');
    t.text('set_json').notNullable();
    t.text('source_json').notNullable();
    t.text('reason').notNullable();
    t.text('status').notNullable().defaultTo('pending');
    t.integer('author_id').notNullable().references('users.id');
    t.integer('reviewer_id').references('users.id');
    t.text('review_comment');
    t.text('created_at').notNullable();
    t.text('reviewed_at');
    t.index(['status']);
  });
  await knex.schema.createTable('alloy_history', (t) => {
    t.increments('id');
    t.text('alloy_slug').notNullable();
    t.integer('revision_id').notNullable().references('revisions.id');
    t.text('field').notNullable();
    t.text('old_json');
    t.text('new_json');
    t.text('at').notNullable();
    t.integer('proposed_by').notNullable().references('users.id');
    t.integer('approved_by').notNullable().references('users.id');
    t.integer('source_id').notNullable().references('sources.id');
    t.text('reason').notNullable();
    t.index(['alloy_slug']);
  });
  await knex.schema.createTable('measurements', (t) => {
    t.increments('id');
    t.integer('alloy_id').notNullable().references('alloys.id').onDelete('CASCADE');
    t.double('conductivity_s_per_m').notNullable();
    t.double('frequency_hz').notNullable();
    t.double('temperature_k').notNullable();
    t.double('uncertainty_percent').notNullable();
    t.text('sample').notNullable();
    t.text('instrument').notNullable();
    t.integer('source_id').notNullable().references('sources.id');
    t.integer('revision_id').notNullable().references('revisions.id');
  });
  await knex.schema.createTable('releases', (t) => {
    t.increments('id');
    t.text('version').notNullable().unique();
    t.text('created_at').notNullable();
    t.integer('created_by').notNullable().references('users.id');
    t.text('checksum').notNullable();
    t.text('snapshot_json').notNullable();
    t.text('changelog_json').notNullable();
  });
}

export async function down(knex: Knex): Promise<void> {
  for (const table of ['releases', 'measurements', 'alloy_history', 'revisions'])
    await knex.schema.dropTable(table);
}
