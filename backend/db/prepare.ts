import type { Knex } from 'knex';
import { dialectOf, withAdvisoryLock } from './dialect';
import { PRAGMAS } from './knex';
import { demoAccountSeeds, demoSeeds, referenceSeeds } from './seed-source';

export interface PrepareOptions {
  /** Load the invented demo scenario as well as the reference table. */
  demo: boolean;
  /** Load the demo accounts (one per role, known passwords). */
  demoAccounts?: boolean;
}

/**
 * Brings a database up to date before the server listens: migrations, then the reference table
 * and the demo scenario when the database has none yet (an existing table is never overwritten).
 * On PostgreSQL several instances may start at once: one prepares while the others wait on an
 * advisory lock, then find the work done (Knex's own migration lock would fail them instead, and
 * two seeders would both see an empty table).
 */
export async function prepareDatabase(knex: Knex, options: PrepareOptions): Promise<void> {
  await withAdvisoryLock(knex, 'prepare', () => prepareLocked(knex, options), { wait: true });
}

async function prepareLocked(knex: Knex, options: PrepareOptions): Promise<void> {
  await knex.migrate.latest();
  if (dialectOf(knex) === 'sqlite') await checkPragmas(knex);
  const [{ count }] = (await knex('alloys').count({ count: '*' })) as [{ count: number }];
  if (Number(count) === 0) {
    for (const seed of referenceSeeds) await seed(knex);
  }
  if (options.demo) {
    const [{ stacks }] = (await knex('stacks').count({ stacks: '*' })) as [{ stacks: number }];
    if (Number(stacks) === 0) for (const seed of demoSeeds) await seed(knex);
  }
  if (options.demoAccounts) {
    const [{ users }] = (await knex('users').count({ users: '*' })) as [{ users: number }];
    if (Number(users) === 0) for (const seed of demoAccountSeeds) await seed(knex);
  }
}

/** Reads the pragmas back: a connection without foreign keys would silently accept orphans. */
async function checkPragmas(knex: Knex): Promise<void> {
  const [fk] = (await knex.raw('PRAGMA foreign_keys')) as Array<{ foreign_keys: number }>;
  const [timeout] = (await knex.raw('PRAGMA busy_timeout')) as Array<{ timeout: number }>;
  if (fk?.foreign_keys !== PRAGMAS.foreign_keys || timeout?.timeout !== PRAGMAS.busy_timeout) {
    throw new Error('SQLite pragmas were not applied (foreign_keys, busy_timeout)');
  }
}
