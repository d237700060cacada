import type { Options } from 'express-rate-limit';
import type { Knex } from 'knex';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { KnexRateLimitStore } from '../../backend/http/knex-rate-limit-store';
import { createTestDatabase } from '../helpers/test-app';

/**
 * The rate-limit store that several instances share on PostgreSQL. It is plain Knex, so it runs
 * here on whichever database the tests use: SQLite under npm test, PostgreSQL under test:pg.
 */
let knex: Knex;
const stores: KnexRateLimitStore[] = [];
const store = (prefix: string, windowMs = 60_000) => {
  const s = new KnexRateLimitStore(knex, prefix);
  s.init({ windowMs } as Options);
  stores.push(s);
  return s;
};
beforeAll(async () => {
  knex = await createTestDatabase();
});
afterAll(async () => {
  for (const s of stores) s.shutdown();
  await knex.destroy();
});

describe('KnexRateLimitStore', () => {
  it('counts hits per key, with the end of the window', async () => {
    const s = store('count:');
    const before = Date.now();
    const first = await s.increment('ip:1');
    expect(first.totalHits).toBe(1);
    expect(first.resetTime!.getTime()).toBeGreaterThanOrEqual(before + 60_000);
    expect((await s.increment('ip:1')).totalHits).toBe(2);
    expect((await s.increment('ip:2')).totalHits).toBe(1);
    expect(await s.get('ip:1')).toEqual({ totalHits: 2, resetTime: first.resetTime });
    expect(await s.get('ip:3')).toBeUndefined();
  });

  it('keeps limiters apart by prefix', async () => {
    const a = store('a:');
    const b = store('b:');
    await a.increment('ip:1');
    await a.increment('ip:1');
    expect((await b.increment('ip:1')).totalHits).toBe(1);
  });

  it('counts every one of many hits at once (one upsert each, no lost update)', async () => {
    const s = store('burst:');
    const hits = await Promise.all(Array.from({ length: 25 }, () => s.increment('ip:9')));
    expect(hits.map((h) => h.totalHits).sort((x, y) => x - y)).toEqual(
      Array.from({ length: 25 }, (_, i) => i + 1),
    );
  });

  it('starts a new window once the old one has ended', async () => {
    const s = store('window:', 200);
    await s.increment('ip:1');
    await s.increment('ip:1');
    await new Promise((r) => setTimeout(r, 250));
    expect(await s.get('ip:1')).toBeUndefined();
    expect((await s.increment('ip:1')).totalHits).toBe(1);
  });

  it('takes back a hit and forgets a key', async () => {
    const s = store('undo:');
    await s.increment('ip:1');
    await s.increment('ip:1');
    await s.decrement('ip:1');
    expect((await s.get('ip:1'))?.totalHits).toBe(1);
    await s.resetKey('ip:1');
    expect(await s.get('ip:1')).toBeUndefined();
  });
});
