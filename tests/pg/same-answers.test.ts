import type { Knex } from 'knex';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createAlloyRepository } from '../../backend/db/alloy-repository';
import { createKnex } from '../../backend/db/knex';
import { prepareDatabase } from '../../backend/db/prepare';
import { createReleaseService } from '../../backend/services/releases';
import { createTestDatabase } from '../helpers/test-app';
import { testPostgresUrl } from '../helpers/test-database';

/**
 * The same seeded table on both databases reads back the same, to the last bit of every double
 * and the type of every flag, so a release of it has the same canonical JSON and checksum.
 */
if (!testPostgresUrl) throw new Error('tests/pg needs DATABASE_URL=postgres://… (npm run test:pg)');

let sqlite: Knex;
let postgres: Knex;
beforeAll(async () => {
  sqlite = createKnex(':memory:');
  await prepareDatabase(sqlite, { demo: true, demoAccounts: true });
  postgres = await createTestDatabase({ accounts: true });
});
afterAll(async () => {
  await sqlite.destroy();
  await postgres.destroy();
});

describe('SQLite and PostgreSQL give the same answers', () => {
  it('read the same published table, values, sources and flags', async () => {
    const [a, b] = await Promise.all(
      [sqlite, postgres].map((k) => createAlloyRepository(k).listPublished()),
    );
    expect(b).toEqual(a);
    expect(b!.length).toBeGreaterThanOrEqual(45);
  });

  it('publish a release with the same canonical JSON checksum', async () => {
    const publish = async (k: Knex) => {
      const admin = (await k('users').where({ role: 'admin' }).first('id')) as { id: number };
      return createReleaseService(k, createAlloyRepository(k)).publish(admin.id);
    };
    const [a, b] = [await publish(sqlite), await publish(postgres)];
    expect(b.version).toBe(a.version);
    expect(b.checksum).toBe(a.checksum);
    expect(b.alloys).toEqual(a.alloys);
  });

  it('migrate all the way down and up again', async () => {
    await postgres.migrate.rollback(undefined, true);
    expect(await postgres.schema.hasTable('alloys')).toBe(false);
    await postgres.migrate.latest();
    expect(await postgres.schema.hasTable('rate_limits')).toBe(true);
  });
});
