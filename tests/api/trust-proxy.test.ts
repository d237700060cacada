import request from 'supertest';
import { afterAll, describe, expect, it } from 'vitest';
import { describeDatabase, parseTrustProxy, readConfig } from '../../backend/config';
import { createTestApp, type TestApp } from '../helpers/test-app';

/**
 * Behind a proxy every request comes from the proxy's address: TRUST_PROXY tells Express which
 * X-Forwarded-For to believe, so the per-address limits count clients, not the proxy (README,
 * "More than one machine"). Off by default: a client cannot pick its own address.
 */
const apps: TestApp[] = [];
afterAll(async () => {
  for (const t of apps) await t.knex.destroy();
});

async function visitorStatuses(trustProxy: boolean | number | string | undefined) {
  const t = await createTestApp({ rateLimits: { visitor: 2 }, trustProxy });
  apps.push(t);
  const statuses: number[] = [];
  for (const client of ['203.0.113.7', '203.0.113.7', '198.51.100.9'])
    statuses.push(
      (await request(t.app).get('/api/v1/health').set('X-Forwarded-For', client)).status,
    );
  return statuses;
}

describe('TRUST_PROXY', () => {
  it('is off by default: X-Forwarded-For is ignored and the limit is the address it came from', async () => {
    expect(await visitorStatuses(undefined)).toEqual([200, 200, 429]);
  });

  it('with one proxy trusted, limits count each client behind it', async () => {
    expect(await visitorStatuses(1)).toEqual([200, 200, 200]);
  });

  it('reads the environment: off, a hop count, true, or addresses', () => {
    expect(parseTrustProxy(undefined)).toBe(false);
    expect(parseTrustProxy('')).toBe(false);
    expect(parseTrustProxy('0')).toBe(false);
    expect(parseTrustProxy('false')).toBe(false);
    expect(parseTrustProxy('1')).toBe(1);
    expect(parseTrustProxy('true')).toBe(true);
    expect(parseTrustProxy('loopback, 10.0.0.0/8')).toBe('loopback, 10.0.0.0/8');
    expect(readConfig({}).trustProxy).toBe(false);
  });
});

describe('DATABASE_URL', () => {
  it('must be a PostgreSQL address; unset, the SQLite file is the database', () => {
    expect(readConfig({}).databaseUrl).toBeUndefined();
    expect(readConfig({ DATABASE_URL: 'postgresql://c@db/conductory' }).databaseUrl).toBe(
      'postgresql://c@db/conductory',
    );
    expect(() => readConfig({ DATABASE_URL: 'mysql://c@db/conductory' })).toThrow(/postgres:\/\//);
  });

  it('is logged without its password', () => {
    expect(
      describeDatabase({
        databaseFile: 'x',
        databaseUrl: 'postgres://c:s3cret@db:5432/conductory',
      }),
    ).toBe('postgres://c:***@db:5432/conductory');
  });
});
