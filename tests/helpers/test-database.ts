import crypto from 'node:crypto';
import fs from 'node:fs';
import path from 'node:path';
import type { Knex } from 'knex';
import { withAdvisoryLock } from '../../backend/db/dialect';
import { createKnex, isPostgresUrl } from '../../backend/db/knex';
import { prepareDatabase } from '../../backend/db/prepare';
import { projectRoot } from '../../backend/paths';

/**
 * Where the tests' databases live. Unset (npm test): a fresh in-memory SQLite database each time.
 * With DATABASE_URL a postgres:// address (npm run test:pg): a fresh PostgreSQL database each time,
 * copied from a migrated and seeded template database (CREATE DATABASE … TEMPLATE takes a fraction
 * of a second; seeding with bcrypt-hashed demo accounts every time would take seconds).
 */
export const testPostgresUrl =
  process.env.DATABASE_URL && isPostgresUrl(process.env.DATABASE_URL)
    ? process.env.DATABASE_URL
    : undefined;

/** The same server and credentials, another database. */
export function postgresUrlFor(database: string): string {
  const url = new URL(testPostgresUrl!);
  url.pathname = `/${database}`;
  return url.toString();
}

let admin: Knex | undefined;
const adminKnex = () => (admin ??= createKnex(testPostgresUrl!, { min: 0, max: 2 }));

/** Files whose change makes a template stale: the migrations and the seeds. */
function fingerprint(): string {
  const hash = crypto.createHash('sha256');
  const walk = (dir: string) => {
    for (const entry of fs
      .readdirSync(dir, { withFileTypes: true })
      .sort((a, b) => a.name.localeCompare(b.name))) {
      const file = path.join(dir, entry.name);
      if (entry.isDirectory()) walk(file);
      else hash.update(entry.name).update(fs.readFileSync(file));
    }
  };
  walk(path.join(projectRoot, 'migrations'));
  walk(path.join(projectRoot, 'seeds'));
  return hash.digest('hex').slice(0, 12);
}

/**
 * The template for a kind of test database, made once per cluster (and again when a migration or
 * a seed changes): built under another name, then renamed, so a half-built one is never copied.
 */
async function template(accounts: boolean): Promise<string> {
  const name = `conductory_tpl_${accounts ? 'accounts' : 'plain'}_${fingerprint()}`;
  const db = adminKnex();
  await withAdvisoryLock(
    db,
    'test-templates',
    async () => {
      const exists = await db('pg_database').where({ datname: name }).first('datname');
      if (exists) return;
      const building = `${name}_${crypto.randomBytes(4).toString('hex')}`;
      await db.raw('CREATE DATABASE ??', [building]);
      const knex = createKnex(postgresUrlFor(building), { min: 0, max: 2 });
      try {
        await prepareDatabase(knex, { demo: true, demoAccounts: accounts });
      } finally {
        await knex.destroy();
      }
      await db.raw('ALTER DATABASE ?? RENAME TO ??', [building, name]);
    },
    { wait: true },
  );
  return name;
}

let made = 0;

/** A new, migrated and seeded PostgreSQL database of its own; returns its address. */
export async function createTestPostgresDatabase(accounts: boolean): Promise<string> {
  const source = await template(accounts);
  const name = `conductory_test_${process.pid}_${++made}_${crypto.randomBytes(3).toString('hex')}`;
  await adminKnex().raw('CREATE DATABASE ?? TEMPLATE ??', [name, source]);
  return postgresUrlFor(name);
}
