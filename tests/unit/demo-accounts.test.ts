import { afterEach, describe, expect, it } from 'vitest';
import { createKnex } from '../../backend/db/knex';
import { seed } from '../../seeds/03_demo_accounts';

const saved = { NODE_ENV: process.env.NODE_ENV, DEMO_ACCOUNTS: process.env.DEMO_ACCOUNTS };
afterEach(() => Object.assign(process.env, saved));

describe('demo accounts seed', () => {
  it('is refused in production unless DEMO_ACCOUNTS=1 says so', async () => {
    const knex = createKnex(':memory:');
    await knex.migrate.latest();
    process.env.NODE_ENV = 'production';
    delete process.env.DEMO_ACCOUNTS;
    await expect(seed(knex)).rejects.toThrow(/refused in production/);
    process.env.DEMO_ACCOUNTS = '1';
    await seed(knex);
    expect((await knex('users').count({ n: '*' }))[0]).toEqual({ n: 5 });
    await knex.destroy();
  });
});
