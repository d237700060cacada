// Issue 8: calculators off the event loop. The worker pool stops a job that overruns its limit,
// answers 503 with Retry-After when its queue is full, keeps serving after a stopped thread, and
// leaves the event loop free for everyone else meanwhile.
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createEstimatePool, type EstimatePool } from '../../backend/estimates/pool';
import { heaviestLaunch, typicalLaunch } from '../helpers/launches';
import { createTestApp, type TestApp } from '../helpers/test-app';

let t: TestApp;
let pool: EstimatePool;
beforeAll(async () => {
  pool = createEstimatePool({ threads: 1, maxQueue: 2, computeLimitMs: 300 });
  t = await createTestApp({ estimatePool: pool });
});
afterAll(async () => {
  await pool.close();
  await t.knex.destroy();
});

const launch = (body: object) => request(t.app).post('/api/v1/estimates/launch').send(body);

describe('the calculators’ worker pool', () => {
  it('a launch beyond the compute limit is stopped: 422 problem+json saying so', async () => {
    const res = await launch(heaviestLaunch);
    expect(res.status).toBe(422);
    expect(res.type).toBe('application/problem+json');
    expect(res.body.detail).toMatch(/more than the 0.3 s/);
  });

  it('jobs queued behind a stopped one still run (the stopped thread is replaced)', async () => {
    const answers = await Promise.all([
      launch(heaviestLaunch),
      launch(heaviestLaunch),
      launch(typicalLaunch),
    ]);
    expect(answers.map((r) => r.status)).toEqual([422, 422, 200]);
  });

  it('a full queue answers 503 with Retry-After, as problem+json', async () => {
    const answers = await Promise.all(Array.from({ length: 6 }, () => launch(heaviestLaunch)));
    const busy = answers.filter((r) => r.status === 503);
    expect(busy.length).toBeGreaterThan(0);
    expect(busy[0]!.headers['retry-after']).toBe('1');
    expect(busy[0]!.type).toBe('application/problem+json');
    expect(answers.every((r) => r.status === 503 || r.status === 422)).toBe(true);
  });

  it('the event loop answers /health while a launch computes', async () => {
    const order: string[] = [];
    const slow = launch(heaviestLaunch).then(() => order.push('launch'));
    await new Promise((r) => setTimeout(r, 50));
    const health = await request(t.app).get('/api/v1/health');
    order.push('health');
    await slow;
    expect(health.status).toBe(200);
    expect(order).toEqual(['health', 'launch']);
  });

  it('visitors get their own, lower limit for calculations (429 with Retry-After)', async () => {
    const limited = await createTestApp({ estimateLimits: { visitor: 2 } });
    const body = {
      material: { alloy: 'copper-c11000' },
      frequencies: [{ value: 60, unit: 'Hz' }],
    };
    const post = () => request(limited.app).post('/api/v1/estimates/skin-depth').send(body);
    expect((await post()).status).toBe(200);
    expect((await post()).status).toBe(200);
    const third = await post();
    expect(third.status).toBe(429);
    expect(third.headers['retry-after']).toBeDefined();
    // Look-ups are not calculations: the catalogue still answers.
    expect((await request(limited.app).get('/api/v1/alloys?q=brass')).status).toBe(200);
    await limited.knex.destroy();
  });
});
