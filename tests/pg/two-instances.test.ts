import crypto from 'node:crypto';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createKnex } from '../../backend/db/knex';
import { createAccountRepositories } from '../../backend/db/account-repositories';
import { runExpiryNotices } from '../../backend/services/expiry-notices';
import { createKeyService } from '../../backend/services/keys';
import { bearer, demo, newKey, sessionCookieOf, signedIn } from '../helpers/access';
import { createTestApp, TEST_PUBLIC_URL, type TestApp } from '../helpers/test-app';
import { createTestPostgresDatabase, testPostgresUrl } from '../helpers/test-database';

/**
 * Two instances of the app behind one proxy, on one PostgreSQL database (npm run test:pg; the
 * vitest config leaves tests/pg out when DATABASE_URL is not PostgreSQL). Each instance has its
 * own Knex pool, mailer and memory, as two processes would; they share only the database and the
 * JWT secret, as a deployment must (README, "More than one machine").
 */
if (!testPostgresUrl) throw new Error('tests/pg needs DATABASE_URL=postgres://… (npm run test:pg)');

const instances: TestApp[] = [];

/** Two instances on a new database of their own, with the limits a test gives. */
async function twoInstances(overrides: Parameters<typeof createTestApp>[0] = {}) {
  const url = await createTestPostgresDatabase(true);
  const jwtSecret = crypto.randomBytes(32);
  const [a, b] = await Promise.all(
    [0, 1].map(() =>
      createTestApp({ ...overrides, knex: createKnex(url, { min: 0, max: 4 }), jwtSecret }),
    ),
  );
  instances.push(a!, b!);
  return [a!, b!] as const;
}

afterAll(async () => {
  for (const i of instances) {
    await i.mailer.close();
    await i.knex.destroy();
  }
});

describe('two instances on one PostgreSQL database', () => {
  it('share a rate limit: a visitor gets 4 requests a minute in all, not 4 from each', async () => {
    const [a, b] = await twoInstances({ rateLimits: { visitor: 4 } });
    const statuses: number[] = [];
    for (let i = 0; i < 6; i++)
      statuses.push((await request(i % 2 ? b.app : a.app).get('/api/v1/health')).status);
    // With each instance counting in its own memory this would be six 200s.
    expect(statuses).toEqual([200, 200, 200, 200, 429, 429]);
  });

  it('share the sign-in throttle per address', async () => {
    const [a, b] = await twoInstances({
      credentialLimits: { perAddress: 3, perAccount: 100, perAccountCeiling: 100 },
    });
    const statuses: number[] = [];
    for (let i = 0; i < 4; i++) {
      const res = await request(i % 2 ? b.app : a.app)
        .post('/api/v1/auth/sign-in')
        .set('Origin', TEST_PUBLIC_URL)
        .send({ email: `nobody${i}@carrowbay.example`, password: 'wrong-password-1' });
      statuses.push(res.status);
    }
    expect(statuses).toEqual([401, 401, 401, 429]);
  });

  describe('with generous limits', () => {
    let a: TestApp;
    let b: TestApp;
    beforeAll(async () => ([a, b] = await twoInstances()));

    it('refuse a key on the other instance as soon as one revokes it', async () => {
      const owner = await signedIn(a.app, 'integrator');
      const { key, id } = await newKey(owner, 'reader');
      expect((await request(b.app).get('/api/v1/me').set(bearer(key))).status).toBe(200);
      expect((await owner.delete(`/api/v1/keys/${id}`)).status).toBe(204);
      const refused = await request(b.app).get('/api/v1/me').set(bearer(key));
      expect(refused.status).toBe(401);
      expect(refused.type).toBe('application/problem+json');
    });

    it('end a session everywhere when it is signed out on one', async () => {
      const who = demo('reader');
      const signIn = await request(a.app)
        .post('/api/v1/auth/sign-in')
        .set('Origin', TEST_PUBLIC_URL)
        .send({ email: who.email, password: who.password });
      const cookie = `conductory_session=${sessionCookieOf(signIn.headers['set-cookie'])}`;
      const onB = () => request(b.app).get('/api/v1/me').set('Cookie', cookie);
      expect((await onB()).status).toBe(200);
      const signOut = await request(a.app)
        .post('/api/v1/auth/sign-out')
        .set('Origin', TEST_PUBLIC_URL)
        .set('Cookie', cookie);
      expect(signOut.status).toBe(204);
      expect((await onB()).status).toBe(401);
    });

    it('read a revision approved on one instance on the other at once', async () => {
      const slug = 'cartridge-brass-c26000';
      const conductivity = async (app: TestApp) =>
        (await request(app.app).get(`/api/v1/alloys/${slug}`)).body.values.find(
          (v: { quantity: string }) => v.quantity === 'conductivity',
        ).nominal as number;
      // B builds its in-memory catalogue first, so a stale copy would show.
      expect(await conductivity(b)).toBeCloseTo(16.24e6, 0);
      const author = await signedIn(a.app, 'curator');
      const proposal = await author.post('/api/v1/revisions').send({
        kind: 'edit',
        alloy: slug,
        set: { values: { conductivity: { nominal: 16.0e6, min: 15.66e6, max: 16.82e6 } } },
        source: {
          citation: 'Mill test certificate (invented for the test)',
          kind: 'measurement_set',
        },
        reason: 'Lot measurements read 27.6 %IACS on average',
      });
      expect(proposal.status).toBe(201);
      const reviewer = await signedIn(a.app, {
        email: 'curator2@carrowbay.example',
        password: 'curator2-demo-2026',
      });
      const approved = await reviewer
        .post(`/api/v1/revisions/${proposal.body.id}/review`)
        .send({ decision: 'approve', comment: 'certificates checked' });
      expect(approved.status).toBe(200);
      expect(await conductivity(b)).toBe(16.0e6);
      // And the search (the same in-memory catalogue) agrees.
      const found = await request(b.app).get('/api/v1/alloys?q=C26000');
      expect(found.body.items[0].conductivitySPerM).toBe(16.0e6);
    });

    it('let one approval of a revision win when both instances approve at once', async () => {
      const author = await signedIn(a.app, 'curator');
      const proposal = await author.post('/api/v1/revisions').send({
        kind: 'edit',
        alloy: 'gilding-metal-c21000',
        set: { notes: 'Checked against a second certificate (invented for the test)' },
        source: {
          citation: 'Mill test certificate (invented for the test)',
          kind: 'measurement_set',
        },
        reason: 'A note for the sorter',
      });
      expect(proposal.status).toBe(201);
      const reviewers = await Promise.all(
        [a, b].map((i) =>
          signedIn(i.app, { email: 'curator2@carrowbay.example', password: 'curator2-demo-2026' }),
        ),
      );
      const statuses = (
        await Promise.all(
          reviewers.map((r) =>
            r
              .post(`/api/v1/revisions/${proposal.body.id}/review`)
              .send({ decision: 'approve', comment: 'fine' }),
          ),
        )
      )
        .map((r) => r.status)
        .sort();
      expect(statuses).toEqual([200, 409]);
      const history = (
        await request(b.app).get('/api/v1/alloys/gilding-metal-c21000/history')
      ).body.items.filter((h: { revisionId: number }) => h.revisionId === proposal.body.id);
      expect(history).toHaveLength(1);
    });

    it('send one expiry mail, not two, when both run the hourly job at the same moment', async () => {
      const owner = await signedIn(a.app, 'integrator');
      const soon = new Date(Date.now() + 2 * 86_400_000).toISOString();
      const { prefix } = await newKey(owner, 'reader', 'expiring soon', soon);
      const job = (i: TestApp) =>
        runExpiryNotices(
          i.knex,
          createKeyService({
            repos: createAccountRepositories(i.knex),
            secret: i.jwtSecret,
            mailer: i.mailer,
            publicUrl: () => TEST_PUBLIC_URL,
            production: false,
          }),
        );
      const rounds = await Promise.all([job(a), job(b), job(a), job(b)]);
      const mails = [...a.mail.sent, ...b.mail.sent].filter(
        (m) => m.template === 'key-expiring' && m.text.includes(prefix),
      );
      expect(mails).toHaveLength(1);
      expect(mails[0]!.to).toBe(demo('integrator').email);
      // Rounds that found the job held elsewhere report null; the one that ran sent the mail.
      expect(rounds.filter((r) => r === 1)).toHaveLength(1);
      // A later round on either instance finds the notice sent.
      expect(await job(b)).toBe(0);
      expect(await job(a)).toBe(0);
    });
  });
});
