import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import crypto from 'node:crypto';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createApp } from '../../backend/app';
import { createKnex } from '../../backend/db/knex';
import { prepareDatabase } from '../../backend/db/prepare';
import { createMailer } from '../../backend/mail/mailer';
import { createOutboxRepository } from '../../backend/mail/outbox-repository';
import { createAccountRepositories } from '../../backend/db/account-repositories';
import { createKeyService } from '../../backend/services/keys';
import { bearer, newKey, signedIn } from '../helpers/access';
import { mailCapture, TEST_PUBLIC_URL } from '../helpers/test-app';

// A file database, so the test can read the bytes on disk for plaintext secrets.
const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'conductory-access-'));
const file = path.join(dir, 'access.sqlite');
const knex = createKnex(file);
let app: ReturnType<typeof createApp>;
let mailer: Awaited<ReturnType<typeof createMailer>>;
const jwtSecret = crypto.randomBytes(32);
const unlimited = { visitor: 1e6, reader: 1e6, integrator: 1e6, curator: 1e6, admin: 1e6 };
// The newcomer's own mailbox: the mailer's local delivery (the admin Outbox masks tokens).
const mail = mailCapture();

beforeAll(async () => {
  await prepareDatabase(knex, { demo: true, demoAccounts: true });
  mailer = await createMailer(createOutboxRepository(knex), undefined, {
    localDelivery: mail.localDelivery,
  });
  app = createApp({
    knex,
    mailer,
    jwtSecret,
    publicUrl: () => TEST_PUBLIC_URL,
    publicOrigin: TEST_PUBLIC_URL,
    serveClient: false,
    rateLimits: unlimited,
    credentialLimits: { perAddress: 1e6, perAccount: 1e6, perAccountCeiling: 1e6 },
  });
});
afterAll(async () => {
  await mailer.close();
  await knex.destroy();
  fs.rmSync(dir, { recursive: true, force: true });
});

const newcomer = {
  email: 'newcomer@ridgeline.example',
  password: 'copper-brass-zinc-42',
  name: 'A. Newcomer',
};
const credentials = () => ({ email: newcomer.email, password: newcomer.password });

async function outboxFor(email: string) {
  const admin = await signedIn(app, 'admin');
  const res = await admin.get(`/api/v1/admin/outbox?to=${encodeURIComponent(email)}`);
  return res.body.items as Array<{ subject: string; text: string; template: string }>;
}

describe('sign-up, verification through the local outbox, sign-in', () => {
  let verifyToken = '';

  it('sign-up → 202, and the verification message lands in the outbox with its token masked', async () => {
    const res = await request(app).post('/api/v1/auth/sign-up').send(newcomer);
    expect(res.status).toBe(202);
    verifyToken = mail.tokenFor(newcomer.email, 'verification');
    expect(verifyToken).toMatch(/^[A-Za-z0-9_-]{20,}$/);
    const filed = (await outboxFor(newcomer.email)).find((m) => m.template === 'verification');
    expect(filed?.subject).toMatch(/Confirm your e-mail/);
    expect(filed?.text).toContain('http://conductory.test/verify?token=••••••••');
    expect(filed?.text).not.toContain(verifyToken);
  });

  it('the same answer for an address that already has an account (no enumeration)', async () => {
    const again = await request(app).post('/api/v1/auth/sign-up').send(newcomer);
    expect(again.status).toBe(202);
    const fresh = await request(app)
      .post('/api/v1/auth/sign-up')
      .send({ ...newcomer, email: 'someone-else@ridgeline.example' });
    expect(again.body).toEqual(fresh.body);
  });

  it('refuses sign-in before verification, then the link verifies once', async () => {
    const early = await request(app).post('/api/v1/auth/sign-in').send(credentials());
    expect(early.status).toBe(403);
    expect(
      (await request(app).post('/api/v1/auth/verify').send({ token: verifyToken })).status,
    ).toBe(200);
    const twice = await request(app).post('/api/v1/auth/verify').send({ token: verifyToken });
    expect(twice.status).toBe(400);
    expect(twice.body.errors[0].path).toBe('/body/token');
  });

  it('signs in with an HttpOnly, SameSite=Strict cookie and /me tells the role', async () => {
    const res = await request(app).post('/api/v1/auth/sign-in').send(credentials());
    expect(res.status).toBe(200);
    const cookie = String(res.headers['set-cookie']);
    expect(cookie).toMatch(/conductory_session=/);
    expect(cookie).toMatch(/HttpOnly/);
    expect(cookie).toMatch(/SameSite=Strict/);
    const agent = await signedIn(app, credentials());
    const me = await agent.get('/api/v1/me');
    expect(me.body).toMatchObject({ email: newcomer.email, role: 'reader', emailVerified: true });
  });

  it('a wrong password and an unknown account get the same 401', async () => {
    const wrong = await request(app)
      .post('/api/v1/auth/sign-in')
      .send({ ...credentials(), password: 'not-the-password' });
    const unknown = await request(app)
      .post('/api/v1/auth/sign-in')
      .send({ email: 'nobody@ridgeline.example', password: 'not-the-password' });
    expect(wrong.status).toBe(401);
    expect(unknown.status).toBe(401);
    expect(wrong.body.detail).toBe(unknown.body.detail);
  });

  it('refuses short, long and common passwords', async () => {
    for (const password of ['short', 'x'.repeat(65), 'password123']) {
      const res = await request(app)
        .post('/api/v1/auth/sign-up')
        .send({ ...newcomer, email: `p${password.length}@ridgeline.example`, password });
      expect(res.status, password).toBe(400);
    }
    // 40 three-byte characters: 40 characters but 120 bytes, past bcrypt's 72.
    const wide = await request(app)
      .post('/api/v1/auth/sign-up')
      .send({ ...newcomer, email: 'wide@ridgeline.example', password: '€'.repeat(40) });
    expect(wide.status).toBe(400);
    expect(wide.body.detail).toMatch(/72 bytes/);
  });

  it('stores bcrypt hashes of cost ≥ 10, read from the hash prefix', async () => {
    const row = await knex('users').where({ email: newcomer.email }).first();
    const cost = Number(/^\$2[aby]\$(\d\d)\$/.exec(row.password_hash)![1]);
    expect(cost).toBeGreaterThanOrEqual(10);
  });
});

describe('password reset by e-mail', () => {
  it('mails a link, the link sets a new password once, and old sessions end', async () => {
    const agent = await signedIn(app, credentials());
    expect((await agent.get('/api/v1/me')).status).toBe(200);
    expect(
      (await request(app).post('/api/v1/auth/reset-request').send({ email: newcomer.email }))
        .status,
    ).toBe(202);
    const unknown = await request(app)
      .post('/api/v1/auth/reset-request')
      .send({ email: 'nobody@ridgeline.example' });
    expect(unknown.status).toBe(202);
    const token = mail.tokenFor(newcomer.email, 'reset');
    const filed = (await outboxFor(newcomer.email)).find((m) => m.template === 'reset')!;
    expect(filed.text).toContain('/reset?token=••••••••');
    expect(filed.text).not.toContain(token);
    newcomer.password = 'zinc-brass-copper-43';
    expect(
      (await request(app).post('/api/v1/auth/reset').send({ token, password: newcomer.password }))
        .status,
    ).toBe(200);
    expect(
      (await request(app).post('/api/v1/auth/reset').send({ token, password: 'another-one-44' }))
        .status,
    ).toBe(400);
    expect((await agent.get('/api/v1/me')).status).toBe(401);
    expect((await signedIn(app, credentials())).get).toBeDefined();
  });
});

describe('API keys', () => {
  it('creates a key shown once, lists it without the key, and the key calls the API', async () => {
    const agent = await signedIn(app, 'integrator');
    const created = await newKey(agent, 'integrator', 'sorter line 3');
    expect(created.key).toMatch(/^cdy_[A-Za-z0-9_-]{8}_[A-Za-z0-9_-]{43}$/);
    expect(created.key.slice(4, 12)).toBe(created.prefix);
    const list = await agent.get('/api/v1/keys');
    expect(JSON.stringify(list.body)).not.toContain(created.key);
    expect(list.body.items.find((k: { id: number }) => k.id === created.id)).toMatchObject({
      name: 'sorter line 3',
      role: 'integrator',
    });
    const call = await request(app).get('/api/v1/alloys?q=brass').set(bearer(created.key));
    expect(call.status).toBe(200);
    const keyMail = (await outboxFor('integrator@carrowbay.example')).find(
      (m) => m.template === 'key-created',
    );
    expect(keyMail?.text).toContain(created.prefix);
  });

  it('counts usage per key per day per route group', async () => {
    const agent = await signedIn(app, 'reader');
    const { key, id } = await newKey(agent, 'reader');
    for (let i = 0; i < 3; i++) await request(app).get('/api/v1/alloys').set(bearer(key));
    await request(app)
      .post('/api/v1/match')
      .set(bearer(key))
      .send({ conductivity: { value: 28, unit: '%IACS' } });
    await new Promise((r) => setTimeout(r, 50));
    const usage = await agent.get('/api/v1/usage');
    const mine = usage.body.items.filter((u: { keyId: number }) => u.keyId === id);
    expect(mine.find((u: { routeGroup: string }) => u.routeGroup === 'alloys').count).toBe(3);
    expect(mine.find((u: { routeGroup: string }) => u.routeGroup === 'match').count).toBe(1);
  });

  it('revokes at once: the very next request fails', async () => {
    const agent = await signedIn(app, 'reader');
    const { key, id } = await newKey(agent, 'reader');
    expect((await request(app).get('/api/v1/health').set(bearer(key))).status).toBe(200);
    expect((await agent.delete(`/api/v1/keys/${id}`)).status).toBe(204);
    expect((await request(app).get('/api/v1/health').set(bearer(key))).status).toBe(401);
  });

  it('rotates with an overlap: both keys work, the old one until its new expiry', async () => {
    const agent = await signedIn(app, 'reader');
    const old = await newKey(agent, 'reader');
    const rotated = await agent.post(`/api/v1/keys/${old.id}/rotate`).send({ overlapHours: 2 });
    expect(rotated.status).toBe(201);
    expect((await request(app).get('/api/v1/health').set(bearer(old.key))).status).toBe(200);
    expect((await request(app).get('/api/v1/health').set(bearer(rotated.body.key))).status).toBe(
      200,
    );
    const hours = (Date.parse(rotated.body.previousKeyExpiresAt) - Date.now()) / 3600_000;
    expect(hours).toBeGreaterThan(1.9);
    expect(hours).toBeLessThan(2.1);
    const noOverlap = await agent
      .post(`/api/v1/keys/${rotated.body.id}/rotate`)
      .send({ overlapHours: 0 });
    expect((await request(app).get('/api/v1/health').set(bearer(rotated.body.key))).status).toBe(
      401,
    );
    expect((await request(app).get('/api/v1/health').set(bearer(noOverlap.body.key))).status).toBe(
      200,
    );
  });

  it('an expired key fails on the next request', async () => {
    const agent = await signedIn(app, 'reader');
    const { key, id } = await newKey(
      agent,
      'reader',
      'short-lived',
      new Date(Date.now() + 60_000).toISOString(),
    );
    expect((await request(app).get('/api/v1/health').set(bearer(key))).status).toBe(200);
    await knex('api_keys')
      .where({ id })
      .update({ expires_at: new Date(Date.now() - 1000).toISOString() });
    expect((await request(app).get('/api/v1/health').set(bearer(key))).status).toBe(401);
  });

  it('mails a notice before a key expires, once', async () => {
    const agent = await signedIn(app, 'curator');
    await newKey(
      agent,
      'reader',
      'expires in three days',
      new Date(Date.now() + 3 * 86_400_000).toISOString(),
    );
    const access = {
      repos: createAccountRepositories(knex),
      secret: jwtSecret,
      mailer,
      publicUrl: () => TEST_PUBLIC_URL,
      production: false,
    };
    // This key and the one rotated above with a two-hour overlap both expire within the week.
    expect(await createKeyService(access).sendExpiryNotices()).toBeGreaterThanOrEqual(1);
    expect(await createKeyService(access).sendExpiryNotices()).toBe(0);
    await new Promise((r) => setTimeout(r, 100));
    expect(
      (await outboxFor('curator@carrowbay.example')).some((m) => m.template === 'key-expiring'),
    ).toBe(true);
  });

  it('never signs a person into the browser: a key sets no cookie and cannot manage keys', async () => {
    const agent = await signedIn(app, 'reader');
    const { key } = await newKey(agent, 'reader');
    const res = await request(app).get('/api/v1/me').set(bearer(key));
    expect(res.status).toBe(200);
    expect(res.headers['set-cookie']).toBeUndefined();
    expect(
      (await request(app).post('/api/v1/keys').set(bearer(key)).send({ name: 'x', role: 'reader' }))
        .status,
    ).toBe(403);
  });
});

describe('the database files hold no usable secret', () => {
  it('has no plaintext key or password in the SQLite file and its WAL', async () => {
    const agent = await signedIn(app, 'admin');
    const { key } = await newKey(agent, 'reader', 'to look for');
    await knex.raw('PRAGMA wal_checkpoint(FULL)');
    const bytes = Buffer.concat(
      [file, `${file}-wal`].filter((f) => fs.existsSync(f)).map((f) => fs.readFileSync(f)),
    );
    expect(bytes.includes(Buffer.from(key))).toBe(false);
    expect(bytes.includes(Buffer.from(key.slice(13)))).toBe(false);
    expect(bytes.includes(Buffer.from('admin-demo-2026'))).toBe(false);
    expect(bytes.includes(Buffer.from(newcomer.password))).toBe(false);
  });
});

describe('admin: users, keys, audit', () => {
  it('changes a role, which ends the person’s sessions, and the audit log says who did it', async () => {
    const admin = await signedIn(app, 'admin');
    const person = await signedIn(app, credentials());
    const me = (await person.get('/api/v1/me')).body;
    const res = await admin.patch(`/api/v1/users/${me.id}`).send({ role: 'integrator' });
    expect(res.status).toBe(200);
    expect(res.body.role).toBe('integrator');
    expect((await person.get('/api/v1/me')).status).toBe(401);
    const audit = await admin.get('/api/v1/audit');
    const entry = audit.body.items.find(
      (a: { action: string }) => a.action === 'user.role-changed',
    );
    expect(entry).toMatchObject({
      actor: 'admin@carrowbay.example',
      target: `user:${me.id}`,
      detail: { from: 'reader', to: 'integrator' },
    });
    expect(audit.body.items.some((a: { action: string }) => a.action === 'sign-in')).toBe(true);
    expect(audit.body.items.some((a: { action: string }) => a.action === 'key.created')).toBe(true);
  });

  it('disables a person: sessions and keys stop at once', async () => {
    const admin = await signedIn(app, 'admin');
    const person = await signedIn(app, credentials());
    const { key } = await newKey(person, 'reader');
    const id = (await person.get('/api/v1/me')).body.id;
    expect((await admin.patch(`/api/v1/users/${id}`).send({ status: 'disabled' })).status).toBe(
      200,
    );
    expect((await person.get('/api/v1/me')).status).toBe(401);
    expect((await request(app).get('/api/v1/health').set(bearer(key))).status).toBe(401);
    expect((await request(app).post('/api/v1/auth/sign-in').send(credentials())).status).toBe(401);
  });

  it('lists every key for an admin, never the keys', async () => {
    const admin = await signedIn(app, 'admin');
    const res = await admin.get('/api/v1/admin/keys');
    expect(res.status).toBe(200);
    expect(res.body.items.length).toBeGreaterThan(3);
    expect(JSON.stringify(res.body)).not.toMatch(/key_hash|cdy_[A-Za-z0-9_-]{8}_[A-Za-z0-9_-]{43}/);
  });
});

describe('stacks on the account', () => {
  it('keeps the drafts a person moves from the browser', async () => {
    const agent = await signedIn(app, 'reader');
    const drafts = [
      {
        id: 'a1',
        name: 'Token blank',
        diameter: { value: 25, unit: 'mm' },
        layers: [{ alloy: 'gilding-metal-c21000', thickness: { value: 1.6, unit: 'mm' } }],
      },
    ];
    expect((await agent.get('/api/v1/me/stacks')).body.drafts).toEqual([]);
    expect((await agent.put('/api/v1/me/stacks').send({ drafts })).status).toBe(200);
    expect((await agent.get('/api/v1/me/stacks')).body.drafts).toEqual(drafts);
  });
});
