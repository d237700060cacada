// OWASP API1:2023 Broken Object Level Authorization: someone else's id answers like a missing one.
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { bearer, newKey, signedIn } from '../../helpers/access';
import { createTestApp, type TestApp } from '../../helpers/test-app';

let t: TestApp;
beforeAll(async () => (t = await createTestApp({ accounts: true })));
afterAll(() => t.knex.destroy());

describe('API1 object level: another user’s key', () => {
  it.each(['reader', 'integrator', 'curator'] as const)(
    '%s cannot revoke or rotate the integrator’s key (404, the key keeps working)',
    async (role) => {
      const owner = await signedIn(t.app, 'integrator');
      const { key, id } = await newKey(owner, 'reader', 'owned by the integrator');
      const other = await signedIn(t.app, role === 'integrator' ? 'reader' : role);
      expect((await other.delete(`/api/v1/keys/${id}`)).status).toBe(404);
      expect((await other.post(`/api/v1/keys/${id}/rotate`).send({})).status).toBe(404);
      expect((await request(t.app).get('/api/v1/health').set(bearer(key))).status).toBe(200);
    },
  );

  it('an admin may revoke anyone’s key', async () => {
    const owner = await signedIn(t.app, 'reader');
    const { key, id } = await newKey(owner, 'reader');
    const admin = await signedIn(t.app, 'admin');
    expect((await admin.delete(`/api/v1/keys/${id}`)).status).toBe(204);
    expect((await request(t.app).get('/api/v1/health').set(bearer(key))).status).toBe(401);
  });

  it('lists only one’s own keys', async () => {
    const a = await signedIn(t.app, 'reader');
    const b = await signedIn(t.app, 'curator');
    const { id } = await newKey(a, 'reader', 'only mine');
    const theirs = await b.get('/api/v1/keys');
    expect(theirs.body.items.map((k: { id: number }) => k.id)).not.toContain(id);
  });

  it('a missing key id is a 404 too', async () => {
    const a = await signedIn(t.app, 'reader');
    expect((await a.delete('/api/v1/keys/999999')).status).toBe(404);
  });

  it('usage shows only one’s own keys', async () => {
    const a = await signedIn(t.app, 'integrator');
    const { key, id } = await newKey(a, 'integrator');
    await request(t.app).get('/api/v1/alloys').set(bearer(key));
    const b = await signedIn(t.app, 'reader');
    const usage = await b.get('/api/v1/usage');
    expect(usage.body.items.map((u: { keyId: number }) => u.keyId)).not.toContain(id);
  });
});
