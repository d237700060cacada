// OWASP API6:2023 Unrestricted Access to Sensitive Business Flows: no self-escalation, no enumeration, single-use links.
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { signedIn } from '../../helpers/access';
import { createTestApp, type TestApp } from '../../helpers/test-app';

let t: TestApp;
beforeAll(async () => (t = await createTestApp({ accounts: true })));
afterAll(() => t.knex.destroy());

describe('API6 business flows', () => {
  it('a key’s role may not exceed its owner’s', async () => {
    const reader = await signedIn(t.app, 'reader');
    const res = await reader.post('/api/v1/keys').send({ name: 'escalate', role: 'admin' });
    expect(res.status).toBe(403);
    expect(res.body.errors[0].path).toBe('/body/role');
    const integrator = await signedIn(t.app, 'integrator');
    expect(
      (await integrator.post('/api/v1/keys').send({ name: 'ok', role: 'reader' })).status,
    ).toBe(201);
    expect(
      (await integrator.post('/api/v1/keys').send({ name: 'too high', role: 'curator' })).status,
    ).toBe(403);
  });

  it('an admin cannot demote or disable themselves (the last admin could lock everyone out)', async () => {
    const admin = await signedIn(t.app, 'admin');
    const me = (await admin.get('/api/v1/me')).body;
    expect((await admin.patch(`/api/v1/users/${me.id}`).send({ role: 'reader' })).status).toBe(409);
    expect((await admin.patch(`/api/v1/users/${me.id}`).send({ status: 'disabled' })).status).toBe(
      409,
    );
  });

  it('a key already past its expiry cannot be created', async () => {
    const reader = await signedIn(t.app, 'reader');
    const res = await reader
      .post('/api/v1/keys')
      .send({ name: 'old', role: 'reader', expiresAt: '2020-01-01T00:00:00Z' });
    expect(res.status).toBe(400);
  });

  it('sign-up and reset give one answer whether the account exists or not', async () => {
    const a = await request(t.app)
      .post('/api/v1/auth/reset-request')
      .send({ email: 'reader@carrowbay.example' });
    const b = await request(t.app)
      .post('/api/v1/auth/reset-request')
      .send({ email: 'nobody-at-all@ridgeline.example' });
    expect([a.status, b.status]).toEqual([202, 202]);
    expect(a.body).toEqual(b.body);
  });

  it('a made-up verification or reset token is refused', async () => {
    expect(
      (
        await request(t.app)
          .post('/api/v1/auth/verify')
          .send({ token: 'x'.repeat(43) })
      ).status,
    ).toBe(400);
    expect(
      (
        await request(t.app)
          .post('/api/v1/auth/reset')
          .send({ token: 'x'.repeat(43), password: 'brand-new-pass-9' })
      ).status,
    ).toBe(400);
  });
});
