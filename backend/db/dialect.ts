import type { Knex } from 'knex';

/**
 * The two databases Conductory runs on. Almost everything is the same Knex code on both; what
 * differs is asked here, in one place: whether more than one process may share the database (and
 * so whether limits, jobs and caches need to be kept in it), and how to take a lock.
 */
export type Dialect = 'sqlite' | 'postgres';

export function dialectOf(knex: Knex): Dialect {
  return knex.client.config.client === 'pg' ? 'postgres' : 'sqlite';
}

/**
 * Several instances may serve one PostgreSQL database; a SQLite file belongs to one process
 * (backend/db/server-lock.ts refuses a second server), whose memory is the shared state.
 */
export const sharedByInstances = (knex: Knex) => dialectOf(knex) === 'postgres';

/**
 * Runs `work` while holding a named lock across every instance on the database: a PostgreSQL
 * transaction-level advisory lock, held by a transaction that stays open around `work` (which uses
 * other connections of the pool) and released when it ends, even if the process dies. With
 * `wait: false`, returns `{ ran: false }` at once when another instance holds it. On SQLite one
 * process owns the file, so `work` simply runs.
 */
export async function withAdvisoryLock<T>(
  knex: Knex,
  name: string,
  work: () => Promise<T>,
  options: { wait: boolean },
): Promise<{ ran: true; value: T } | { ran: false }> {
  if (dialectOf(knex) !== 'postgres') return { ran: true, value: await work() };
  return knex.transaction(async (trx) => {
    if (options.wait) {
      await trx.raw('SELECT pg_advisory_xact_lock(hashtext(?))', [`conductory:${name}`]);
    } else {
      const result = (await trx.raw('SELECT pg_try_advisory_xact_lock(hashtext(?)) AS got', [
        `conductory:${name}`,
      ])) as { rows: Array<{ got: boolean }> };
      if (!result.rows[0]?.got) return { ran: false } as const;
    }
    return { ran: true, value: await work() } as const;
  });
}

/**
 * Serialises transactions that read-then-write the same rows (next id = max + 1, the next release
 * number) until `trx` ends. SQLite needs nothing: its one connection runs one transaction at a
 * time; on PostgreSQL a transaction-level advisory lock by name does the same across connections
 * and instances.
 */
export async function serializeWith(trx: Knex.Transaction, name: string): Promise<void> {
  if (dialectOf(trx) === 'postgres')
    await trx.raw('SELECT pg_advisory_xact_lock(hashtext(?))', [`conductory:${name}`]);
}
