import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { bearer, newKey, signedIn } from '../helpers/access';
import { createTestApp, type TestApp } from '../helpers/test-app';

/**
 * Usage counting is one upsert per answered request (backend/db/account-repositories.ts). It runs
 * on the tests' database, so test:pg checks the same statement on PostgreSQL (access.test.ts keeps
 * a SQLite file on purpose, to read its bytes).
 */
let t: TestApp;
beforeAll(async () => (t = await createTestApp({ accounts: true })));
afterAll(() => t.knex.destroy());

const usageOf = async (agent: Awaited<ReturnType<typeof signedIn>>, keyId: number) =>
  (
    (await agent.get('/api/v1/usage')).body.items as Array<{
      keyId: number;
      routeGroup: string;
      count: number;
    }>
  ).filter((u) => u.keyId === keyId);

describe('usage per key, day and route group', () => {
  it('counts each answered request once, in parallel too', async () => {
    const agent = await signedIn(t.app, 'reader');
    const { key, id } = await newKey(agent, 'reader');
    await Promise.all(
      Array.from({ length: 8 }, () => request(t.app).get('/api/v1/alloys').set(bearer(key))),
    );
    await request(t.app)
      .post('/api/v1/match')
      .set(bearer(key))
      .send({ conductivity: { value: 28, unit: '%IACS' } });
    // The count is written when the answer has gone out; give the last upsert a moment.
    await new Promise((r) => setTimeout(r, 200));
    const mine = await usageOf(agent, id);
    expect(mine.find((u) => u.routeGroup === 'alloys')?.count).toBe(8);
    expect(mine.find((u) => u.routeGroup === 'match')?.count).toBe(1);
  });
});
