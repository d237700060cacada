// OWASP API8:2023 Security Misconfiguration: headers, no stack traces, no open CORS, cookie flags.
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { demo } from '../../helpers/access';
import { createTestApp, type TestApp } from '../../helpers/test-app';

let t: TestApp;
beforeAll(async () => (t = await createTestApp({ accounts: true })));
afterAll(() => t.knex.destroy());

describe('API8 misconfiguration', () => {
  it('sends helmet’s headers and no x-powered-by', async () => {
    const res = await request(t.app).get('/api/v1/health');
    expect(res.headers['x-powered-by']).toBeUndefined();
    expect(res.headers['x-content-type-options']).toBe('nosniff');
    expect(res.headers['x-frame-options']).toBe('SAMEORIGIN');
    expect(res.headers['content-security-policy']).toContain("default-src 'self'");
    expect(res.headers['referrer-policy']).toBe('no-referrer');
  });
  it('grants no cross-origin access to other sites', async () => {
    const res = await request(t.app)
      .get('/api/v1/alloys')
      .set('Origin', 'https://elsewhere.example');
    expect(res.headers['access-control-allow-origin']).toBeUndefined();
  });
  it('leaks no stack trace or internals in errors', async () => {
    for (const res of [
      await request(t.app)
        .post('/api/v1/match')
        .set('Content-Type', 'application/json')
        .send('{"broken'),
      await request(t.app).get('/api/v1/nowhere'),
      await request(t.app).get('/api/v1/alloys?limit=-1'),
    ]) {
      expect(JSON.stringify(res.body)).not.toMatch(/at .*\.(ts|js):\d+|node_modules|stack/);
    }
  });
  it('sets the session cookie HttpOnly, SameSite=Strict, with a short life', async () => {
    const res = await request(t.app)
      .post('/api/v1/auth/sign-in')
      .send({ email: demo('reader').email, password: demo('reader').password });
    const cookie = String(res.headers['set-cookie']);
    expect(cookie).toMatch(/HttpOnly/);
    expect(cookie).toMatch(/SameSite=Strict/);
    const maxAge = Number(/Max-Age=(\d+)/.exec(cookie)![1]);
    expect(maxAge).toBeLessThanOrEqual(15 * 60);
  });
  it('refuses a cookie-authenticated write from another site', async () => {
    const signIn = await request(t.app)
      .post('/api/v1/auth/sign-in')
      .send({ email: demo('reader').email, password: demo('reader').password });
    const cookie = String(signIn.headers['set-cookie']).split(';')[0]!;
    const res = await request(t.app)
      .post('/api/v1/keys')
      .set('Cookie', cookie)
      .set('Origin', 'https://evil.example')
      .send({ name: 'x', role: 'reader' });
    expect(res.status).toBe(403);
  });
});
