// OWASP API4:2023 Unrestricted Resource Consumption: body, page, calculator caps and rate limits.
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { demo } from '../../helpers/access';
import { createTestApp, type TestApp } from '../../helpers/test-app';

let t: TestApp;
let limited: TestApp;
let throttled: TestApp;
beforeAll(async () => {
  t = await createTestApp({ accounts: true });
  limited = await createTestApp({
    accounts: true,
    rateLimits: { visitor: 3, reader: 5, integrator: 5, curator: 5, admin: 5 },
  });
  throttled = await createTestApp({
    accounts: true,
    credentialLimits: { perAddress: 100, perAccount: 2 },
  });
});
afterAll(async () => {
  for (const a of [t, limited, throttled]) await a.knex.destroy();
});

describe('API4 resource consumption: caps', () => {
  it('refuses a JSON body over the limit with 413', async () => {
    const res = await request(t.app)
      .post('/api/v1/match')
      .send({ conductivity: { value: 1, unit: '%IACS' }, pad: 'x'.repeat(100_000) });
    expect(res.status).toBe(413);
  });
  it('caps the page size, the frequencies, the layers and the filaments', async () => {
    expect((await request(t.app).get('/api/v1/alloys?limit=101')).status).toBe(400);
    const coil = {
      innerRadius: { value: 2, unit: 'mm' },
      outerRadius: { value: 4, unit: 'mm' },
      length: { value: 2, unit: 'mm' },
      turns: 100,
    };
    const layer = { material: { alloy: 'copper-c11000' }, thickness: { value: 1, unit: 'mm' } };
    const sweep = (n: number, layers = 1) => ({
      coil,
      liftOff: { value: 0.5, unit: 'mm' },
      layers: Array(layers).fill(layer),
      frequencies: Array.from({ length: n }, (_, i) => ({ value: i + 1, unit: 'kHz' })),
    });
    expect((await request(t.app).post('/api/v1/estimates/impedance').send(sweep(501))).status).toBe(
      400,
    );
    expect(
      (await request(t.app).post('/api/v1/estimates/impedance').send(sweep(1, 9))).status,
    ).toBe(400);
    expect((await request(t.app).post('/api/v1/estimates/impedance').send(sweep(500))).status).toBe(
      200,
    );
  });
});

describe('API4 resource consumption: rate limits', () => {
  it('limits a visitor per address with RateLimit headers, then 429 with Retry-After', async () => {
    const statuses: number[] = [];
    let last: request.Response | undefined;
    for (let i = 0; i < 4; i++) {
      last = await request(limited.app).get('/api/v1/health');
      statuses.push(last.status);
    }
    expect(statuses).toEqual([200, 200, 200, 429]);
    expect(last!.type).toBe('application/problem+json');
    expect(Number(last!.headers['retry-after'])).toBeGreaterThan(0);
    expect(last!.headers['ratelimit-policy'] ?? last!.headers['ratelimit']).toBeDefined();
  });
  it('throttles sign-in per account, whether or not it exists, with 429 and Retry-After', async () => {
    const attempt = (email: string) =>
      request(throttled.app)
        .post('/api/v1/auth/sign-in')
        .send({ email, password: 'wrong-password-1' });
    const real = [
      await attempt(demo('reader').email),
      await attempt(demo('reader').email),
      await attempt(demo('reader').email),
    ];
    expect(real.map((r) => r.status)).toEqual([401, 401, 429]);
    expect(Number(real[2]!.headers['retry-after'])).toBeGreaterThan(0);
    const ghost = [
      await attempt('ghost@ridgeline.example'),
      await attempt('ghost@ridgeline.example'),
      await attempt('ghost@ridgeline.example'),
    ];
    expect(ghost.map((r) => r.status)).toEqual([401, 401, 429]);
  });
  it('throttles reset requests per account too', async () => {
    const ask = () =>
      request(throttled.app)
        .post('/api/v1/auth/reset-request')
        .send({ email: demo('curator').email });
    expect([(await ask()).status, (await ask()).status, (await ask()).status]).toEqual([
      202, 202, 429,
    ]);
  });
});
