// Sign-in throttling keyed on the account and the address together (issue 8): a stranger's
// failures lock out the stranger, not the owner; a ceiling per account still caps guessing spread
// over many addresses. Limits are set small here; the defaults are in backend/http/rate-limits.ts.
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEFAULT_CREDENTIAL_LIMITS } from '../../backend/http/rate-limits';
import { demo } from '../helpers/access';
import { createTestApp, type TestApp } from '../helpers/test-app';

let t: TestApp;
let ceilinged: TestApp;
beforeAll(async () => {
  t = await createTestApp({
    accounts: true,
    credentialLimits: { perAddress: 30, perAccount: 10, perAccountCeiling: 100 },
  });
  ceilinged = await createTestApp({
    accounts: true,
    credentialLimits: { perAddress: 30, perAccount: 3, perAccountCeiling: 5 },
  });
  // The test speaks for several addresses through X-Forwarded-For from a trusted loopback proxy.
  for (const app of [t.app, ceilinged.app]) app.set('trust proxy', 'loopback');
});
afterAll(async () => {
  for (const a of [t, ceilinged]) await a.knex.destroy();
});

const STRANGER = '198.51.100.7'; // RFC 5737 documentation addresses
const OWNER = '203.0.113.20';
const ELSEWHERE = (i: number) => `192.0.2.${i + 1}`;

const signIn = (app: TestApp, from: string, email: string, password: string) =>
  request(app.app)
    .post('/api/v1/auth/sign-in')
    .set('X-Forwarded-For', from)
    .send({ email, password });

describe('sign-in throttling per account and address', () => {
  it('has the documented defaults: 30 per address, 10 per account and address, 100 per account', () => {
    expect(DEFAULT_CREDENTIAL_LIMITS).toEqual({
      perAddress: 30,
      perAccount: 10,
      perAccountCeiling: 100,
    });
  });

  it('10 wrong passwords from one address throttle that address, not the owner elsewhere', async () => {
    const owner = demo('reader');
    for (let i = 0; i < 10; i++)
      expect((await signIn(t, STRANGER, owner.email, 'not-the-password-1')).status).toBe(401);
    const blocked = await signIn(t, STRANGER, owner.email, owner.password);
    expect(blocked.status).toBe(429);
    expect(blocked.type).toBe('application/problem+json');
    expect(blocked.body).toMatchObject({ status: 429 });
    expect(Number(blocked.headers['retry-after'])).toBeGreaterThan(0);

    const fromHome = await signIn(t, OWNER, owner.email, owner.password);
    expect(fromHome.status).toBe(200);
    expect(String(fromHome.headers['set-cookie'])).toMatch(/conductory_session=/);
  });

  it('one address is still limited across accounts (30 per 15 minutes)', async () => {
    // 11 attempts so far from STRANGER; 19 more, each on another account, reach the 30.
    const statuses: number[] = [];
    for (let i = 0; i < 20; i++)
      statuses.push(
        (await signIn(t, STRANGER, `nobody-${i}@ridgeline.example`, 'not-the-password-1')).status,
      );
    expect(statuses.slice(0, 19).every((s) => s === 401)).toBe(true);
    expect(statuses[19]).toBe(429);
  });

  it('a ceiling per account stops guessing spread over many addresses', async () => {
    const target = demo('integrator');
    const statuses: number[] = [];
    for (let i = 0; i < 6; i++)
      statuses.push((await signIn(ceilinged, ELSEWHERE(i), target.email, 'guess-guess-1')).status);
    expect(statuses).toEqual([401, 401, 401, 401, 401, 429]);
    // The ceiling is the account's: another account from the same addresses is not affected.
    expect(
      (await signIn(ceilinged, ELSEWHERE(0), demo('admin').email, 'guess-guess-1')).status,
    ).toBe(401);
  });
});
