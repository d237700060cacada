// Cookie-authenticated writes must come from the service's own origin (issue 8; OWASP CSRF
// Prevention Cheat Sheet, "Verifying Origin with standard headers"): never a 500, whatever Origin says.
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { demo, sessionCookieOf } from '../helpers/access';
import { createTestApp, TEST_PUBLIC_URL, type TestApp } from '../helpers/test-app';

let configured: TestApp;
let derived: TestApp;
beforeAll(async () => {
  configured = await createTestApp({ accounts: true });
  // No PUBLIC_URL: the request's own scheme, host and port are expected.
  derived = await createTestApp({ accounts: true, publicOrigin: undefined });
});
afterAll(async () => {
  for (const t of [configured, derived]) await t.knex.destroy();
});

async function cookieOf(t: TestApp): Promise<string> {
  const res = await request(t.app)
    .post('/api/v1/auth/sign-in')
    .send({ email: demo('reader').email, password: demo('reader').password });
  return `conductory_session=${sessionCookieOf(res.headers['set-cookie'])!}`;
}

/** A stack draft save: a small cookie-authenticated write every role may make. */
const write = (t: TestApp, cookie: string) =>
  request(t.app).put('/api/v1/me/stacks').set('Cookie', cookie).send({ drafts: [] });

describe('a cookie write with PUBLIC_URL configured', () => {
  let cookie = '';
  beforeAll(async () => (cookie = await cookieOf(configured)));

  it.each([
    ['no Origin', undefined],
    ['Origin: null', 'null'],
    ['a malformed Origin', 'http://[::1'],
    ['another port', 'http://conductory.test:8080'],
    ['another scheme', 'https://conductory.test'],
    ['another site', 'https://evil.example'],
    ['an Origin with a path', 'http://conductory.test/stacks'],
  ])('%s → 403 problem+json', async (_name, origin) => {
    const req = write(configured, cookie);
    const res = await (origin === undefined ? req : req.set('Origin', origin));
    expect(res.status).toBe(403);
    expect(res.type).toBe('application/problem+json');
    expect(res.body).toMatchObject({ status: 403, title: 'Forbidden' });
  });

  it('the right Origin → 200', async () => {
    const res = await write(configured, cookie).set('Origin', TEST_PUBLIC_URL);
    expect(res.status).toBe(200);
  });

  it('no Origin but Sec-Fetch-Site: same-origin → 200', async () => {
    const res = await write(configured, cookie).set('Sec-Fetch-Site', 'same-origin');
    expect(res.status).toBe(200);
  });

  it('reads need no Origin, and a write with no cookie is not a cookie write', async () => {
    expect((await request(configured.app).get('/api/v1/me').set('Cookie', cookie)).status).toBe(
      200,
    );
    const visitor = await request(configured.app)
      .post('/api/v1/match')
      .set('Origin', 'null')
      .send({ conductivity: { value: 28, unit: '%IACS' } });
    expect(visitor.status).toBe(200);
  });
});

describe('a cookie write without PUBLIC_URL: the request’s own origin', () => {
  let cookie = '';
  beforeAll(async () => (cookie = await cookieOf(derived)));

  it('the Host it was sent to, same scheme and port → 200', async () => {
    const res = await write(derived, cookie)
      .set('Host', 'sorter.local:3000')
      .set('Origin', 'http://sorter.local:3000');
    expect(res.status).toBe(200);
  });

  it.each([
    ['another port', 'http://sorter.local:3001'],
    ['another scheme', 'https://sorter.local:3000'],
    ['another host', 'http://other.local:3000'],
    ['Origin: null', 'null'],
    ['a malformed Origin', 'http://sorter.local:99999'],
  ])('%s → 403', async (_name, origin) => {
    const res = await write(derived, cookie).set('Host', 'sorter.local:3000').set('Origin', origin);
    expect(res.status).toBe(403);
    expect(res.type).toBe('application/problem+json');
  });
});
