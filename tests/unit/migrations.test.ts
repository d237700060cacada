import fs from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { migrations } from '../../backend/db/migration-source';
import { createKnex } from '../../backend/db/knex';
import { projectRoot } from '../../backend/paths';

describe('migrations', () => {
  it('lists every file in migrations/ in the static migration source', () => {
    const files = fs
      .readdirSync(path.join(projectRoot, 'migrations'))
      .filter((f) => f.endsWith('.ts'))
      .map((f) => f.replace(/\.ts$/, ''));
    expect(Object.keys(migrations).sort()).toEqual(files.sort());
  });

  it('go up and all the way down again', async () => {
    const knex = createKnex(':memory:');
    await knex.migrate.latest();
    expect(await knex.schema.hasTable('alloys')).toBe(true);
    await knex.migrate.rollback(undefined, true);
    expect(await knex.schema.hasTable('alloys')).toBe(false);
    await knex.destroy();
  });

  it('set foreign keys and the busy timeout on every connection (quality.md)', async () => {
    const knex = createKnex(':memory:');
    const [fk] = await knex.raw('PRAGMA foreign_keys');
    const [timeout] = await knex.raw('PRAGMA busy_timeout');
    expect(fk.foreign_keys).toBe(1);
    expect(timeout.timeout).toBe(5000);
    await knex.destroy();
  });
});
