import type { Express } from 'express';
import type { Knex } from 'knex';
import { createApp } from '../../backend/app';
import { createKnex } from '../../backend/db/knex';
import { prepareDatabase } from '../../backend/db/prepare';

/** A migrated, seeded in-memory database (reference table and demo scenario). */
export async function createTestDatabase(): Promise<Knex> {
  const knex = createKnex(':memory:');
  await prepareDatabase(knex, { demo: true });
  return knex;
}

/** The API on an in-memory database, without the front end. Destroy the knex after the tests. */
export async function createTestApp(): Promise<{ app: Express; knex: Knex }> {
  const knex = await createTestDatabase();
  return { app: createApp({ knex, serveClient: false }), knex };
}
