import fs from 'node:fs';
import path from 'node:path';
import knexFactory, { type Knex } from 'knex';
import pg from 'pg';
import { migrationSource } from './migration-source';

/**
 * Pragmas per connection (quality.md): WAL for concurrent readers, NORMAL sync (a committed write
 * survives a process crash; the last transactions may be lost on power loss, acceptable for a
 * reference table that can be re-seeded), foreign keys on (SQLite leaves them off), and a busy
 * timeout so a second writer waits instead of failing.
 */
export const PRAGMAS = {
  journal_mode: 'wal',
  synchronous: 1, // NORMAL
  foreign_keys: 1,
  busy_timeout: 5000,
} as const;

interface SqliteConnection {
  pragma(source: string): unknown;
}

/** A `postgres://` or `postgresql://` address (DATABASE_URL); anything else is a SQLite file. */
export function isPostgresUrl(target: string): boolean {
  return /^postgres(ql)?:\/\//i.test(target);
}

export interface PostgresPoolOptions {
  /** Connections kept open while idle (2 for a server, 0 for the tests' many small databases). */
  min?: number;
  max?: number;
}

/**
 * PostgreSQL's bigint (count(*), bigInteger columns) arrives from pg as text, to keep digits past
 * 2^53; SQLite gives numbers. Counts and millisecond times are far below 2^53, so they are read as
 * numbers here, on our connections only, and the same code reads the same values on both.
 */
const pgTypes = {
  getTypeParser: (oid: number, format: string) =>
    oid === pg.types.builtins.INT8
      ? (value: string) => Number(value)
      : pg.types.getTypeParser(oid, format as 'text'),
};

/**
 * The one Knex instance of a process: SQLite (a file, or `:memory:`) by default, PostgreSQL when
 * given a `postgres://` address. Every query, migration and seed goes through the same Knex code;
 * the few places where the dialects differ ask `dialectOf` (backend/db/dialect.ts).
 */
export function createKnex(target: string, pool: PostgresPoolOptions = {}): Knex {
  if (isPostgresUrl(target)) {
    return knexFactory({
      client: 'pg',
      connection: { connectionString: target, application_name: 'conductory', types: pgTypes },
      pool: { min: pool.min ?? 2, max: pool.max ?? 10, idleTimeoutMillis: 10_000 },
      migrations: { migrationSource },
    });
  }
  if (target !== ':memory:') fs.mkdirSync(path.dirname(path.resolve(target)), { recursive: true });
  return knexFactory({
    client: 'better-sqlite3',
    connection: { filename: target },
    useNullAsDefault: true,
    // better-sqlite3 is synchronous: one connection serves every request, and an in-memory
    // database must stay on that one connection or each new one would be empty.
    pool: {
      min: 1,
      max: 1,
      afterCreate: (conn: SqliteConnection, done: (err: Error | null, conn: unknown) => void) => {
        conn.pragma(`journal_mode = ${PRAGMAS.journal_mode}`);
        conn.pragma(`synchronous = ${PRAGMAS.synchronous}`);
        conn.pragma(`foreign_keys = ${PRAGMAS.foreign_keys}`);
        conn.pragma(`busy_timeout = ${PRAGMAS.busy_timeout}`);
        done(null, conn);
      },
    },
    migrations: { migrationSource },
  });
}
