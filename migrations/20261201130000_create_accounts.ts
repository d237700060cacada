import type { Knex } from 'knex';

/** People, their sessions, one-time e-mail tokens, API keys, usage, the audit log and the outbox. */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('users', (t) => {
    t.increments('id');
    t.text('email').notNullable().unique();
    t.text('name').notNullable();
    t.text('password_hash').notNullable();
    t.text('role').notNullable().defaultTo('reader');
    t.text('status').notNullable().defaultTo('active');
    t.text('email_verified_at');
    t.text('created_at').notNullable();
  });
  await knex.schema.createTable('sessions', (t) => {
    t.text('id').primary(); // the JWT's jti
    t.integer('user_id').notNullable().references('users.id').onDelete('CASCADE');
    t.text('created_at').notNullable();
    t.text('expires_at').notNullable();
    t.text('revoked_at');
    t.index(['user_id']);
  });
  await knex.schema.createTable('email_tokens', (t) => {
    t.increments('id');
    t.integer('user_id').notNullable().references('users.id').onDelete('CASCADE');
    t.text('purpose').notNullable();
    t.text('token_hash').notNullable().unique();
    t.text('expires_at').notNullable();
    t.text('used_at');
  });
  await knex.schema.createTable('api_keys', (t) => {
    t.increments('id');
    t.integer('user_id').notNullable().references('users.id').onDelete('CASCADE');
    t.text('name').notNullable();
    t.text('role').notNullable();
    t.text('prefix').notNullable().unique();
    t.text('key_hash').notNullable().unique();
    t.text('created_at').notNullable();
    t.text('expires_at');
    t.text('revoked_at');
    t.text('last_used_at');
    t.integer('rotated_to').references('api_keys.id');
    t.text('expiry_notice_sent_at');
    t.index(['user_id']);
  });
  await knex.schema.createTable('usage', (t) => {
    t.integer('key_id').notNullable().references('api_keys.id').onDelete('CASCADE');
    t.text('day').notNullable();
    t.text('route_group').notNullable();
    t.integer('count').notNullable().defaultTo(0);
    t.primary(['key_id', 'day', 'route_group']);
  });
  await knex.schema.createTable('audit_log', (t) => {
    t.increments('id');
    t.text('at').notNullable();
    t.integer('actor_user_id').references('users.id').onDelete('SET NULL');
    t.text('action').notNullable();
    t.text('target');
    t.text('detail_json');
    t.text('address');
    t.index(['at']);
  });
  await knex.schema.createTable('mail_outbox', (t) => {
    t.increments('id');
    t.text('at').notNullable();
    t.text('to').notNullable();
    t.text('subject').notNullable();
    t.text('text').notNullable();
    t.text('template').notNullable();
  });
  await knex.schema.createTable('user_stacks', (t) => {
    t.integer('user_id').primary().references('users.id').onDelete('CASCADE');
    t.text('drafts_json').notNullable();
    t.text('updated_at').notNullable();
  });
}

export async function down(knex: Knex): Promise<void> {
  for (const table of [
    'user_stacks',
    'mail_outbox',
    'audit_log',
    'usage',
    'api_keys',
    'email_tokens',
    'sessions',
    'users',
  ]) {
    await knex.schema.dropTable(table);
  }
}
