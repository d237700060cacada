// quality.md: logs never hold secrets. Sign in, use the session and an API key, and read the log.
import { Writable } from 'node:stream';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { bearer, newKey, sessionCookieOf, signedIn } from '../helpers/access';
import { createTestApp, TEST_PUBLIC_URL, type TestApp } from '../helpers/test-app';

let t: TestApp;
const lines: string[] = [];
beforeAll(async () => {
  const sink = new Writable({
    write(chunk: Buffer, _enc, done) {
      lines.push(...chunk.toString().split('\n').filter(Boolean));
      done();
    },
  });
  t = await createTestApp({ accounts: true, logLevel: 'info', logStream: sink });
});
afterAll(() => t.knex.destroy());

describe('the request log', () => {
  it('holds neither the session cookie, Set-Cookie, nor the API key', async () => {
    const agent = await signedIn(t.app, 'integrator');
    const signIn = await request(t.app)
      .post('/api/v1/auth/sign-in')
      .send({ email: 'reader@carrowbay.example', password: 'reader-demo-2026' });
    const cookie = sessionCookieOf(signIn.headers['set-cookie'])!;
    expect(cookie.length).toBeGreaterThan(20);
    const { key } = await newKey(agent, 'reader');
    expect((await request(t.app).get('/api/v1/me').set(bearer(key))).status).toBe(200);
    expect(
      (await request(t.app).get('/api/v1/me').set('Cookie', `conductory_session=${cookie}`)).status,
    ).toBe(200);
    await request(t.app).get('/api/v1/me').set('X-API-Key', key);
    await request(t.app)
      .post('/api/v1/auth/sign-out')
      .set('Cookie', `conductory_session=${cookie}`)
      .set('Origin', TEST_PUBLIC_URL);

    const log = lines.join('\n');
    expect(lines.length).toBeGreaterThanOrEqual(6);
    expect(log).not.toContain(cookie);
    expect(log).not.toContain(key);
    expect(log).not.toContain(key.slice(4, 20));
    expect(log).not.toContain('reader-demo-2026');
    expect(log.toLowerCase()).not.toMatch(/set-cookie|authorization|"cookie"/);
  });

  it('is one short line per request: method, path without query, status, time', () => {
    const entry = JSON.parse(lines.find((l) => l.includes('/api/v1/me'))!);
    expect(entry.req).toEqual({ id: expect.anything(), method: 'GET', path: '/api/v1/me' });
    expect(entry.res).toEqual({ status: 200 });
    expect(entry.msg).toMatch(/^GET \/api\/v1\/me 200 \d+ ms$/);
  });
});
