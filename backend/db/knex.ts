import fs from 'node:fs';
import path from 'node:path';
import knexFactory, { type Knex } from 'knex';
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

export function createKnex(databaseFile: string): Knex {
  if (databaseFile !== ':memory:')
    fs.mkdirSync(path.dirname(path.resolve(databaseFile)), { recursive: true });
  return knexFactory({
    client: 'better-sqlite3',
    connection: { filename: databaseFile },
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
