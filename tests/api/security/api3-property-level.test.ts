// OWASP API3:2023 Broken Object Property Level Authorization: no mass assignment, no secret properties out.
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { signedIn } from '../../helpers/access';
import { createTestApp, type TestApp } from '../../helpers/test-app';

let t: TestApp;
beforeAll(async () => (t = await createTestApp({ accounts: true })));
afterAll(() => t.knex.destroy());

describe('API3 property level: the server alone sets role, status and ownership', () => {
  it('sign-up with a role or a status → 400 naming the property', async () => {
    for (const extra of [{ role: 'admin' }, { status: 'active' }, { emailVerified: true }]) {
      const res = await request(t.app)
        .post('/api/v1/auth/sign-up')
        .send({
          email: 'mass@ridgeline.example',
          password: 'brass-fittings-77',
          name: 'M',
          ...extra,
        });
      expect(res.status, JSON.stringify(extra)).toBe(400);
      expect(res.type).toBe('application/problem+json');
    }
  });
  it('a key with an owner or a prefix of the caller’s choosing → 400', async () => {
    const agent = await signedIn(t.app, 'reader');
    expect(
      (await agent.post('/api/v1/keys').send({ name: 'k', role: 'reader', ownerId: 1 })).status,
    ).toBe(400);
    expect(
      (await agent.post('/api/v1/keys').send({ name: 'k', role: 'reader', prefix: 'AAAAAAAA' }))
        .status,
    ).toBe(400);
  });
  it('a user update with a password hash or an e-mail → 400', async () => {
    const admin = await signedIn(t.app, 'admin');
    expect((await admin.patch('/api/v1/users/1').send({ password_hash: 'x' })).status).toBe(400);
    expect((await admin.patch('/api/v1/users/1').send({ email: 'x@y.example' })).status).toBe(400);
  });
  it('no answer carries a password hash or a key hash', async () => {
    const admin = await signedIn(t.app, 'admin');
    await admin.post('/api/v1/keys').send({ name: 'k', role: 'reader' });
    for (const path of [
      '/api/v1/users',
      '/api/v1/admin/keys',
      '/api/v1/keys',
      '/api/v1/me',
      '/api/v1/audit',
    ]) {
      const body = JSON.stringify((await admin.get(path)).body);
      expect(body, path).not.toMatch(/password_hash|passwordHash|key_hash|keyHash|\$2[aby]\$/);
    }
    const signIn = await request(t.app)
      .post('/api/v1/auth/sign-in')
      .send({ email: 'reader@carrowbay.example', password: 'reader-demo-2026' });
    expect(JSON.stringify(signIn.body)).not.toMatch(/password|hash/i);
  });
});
