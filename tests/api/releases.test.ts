import crypto from 'node:crypto';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { canonicalJson } from '../../backend/services/releases';
import { signedIn } from '../helpers/access';
import { createTestApp, type TestApp } from '../helpers/test-app';

let t: TestApp;
beforeAll(async () => (t = await createTestApp({ accounts: true })));
afterAll(() => t.knex.destroy());

const nominal = (body: { values: Array<{ quantity: string; nominal: number }> }) =>
  body.values.find((v) => v.quantity === 'conductivity')!.nominal;

describe('releases', () => {
  let first = '';
  it('publishes an immutable release whose checksum anyone can recompute from its JSON', async () => {
    const curator = await signedIn(t.app, 'curator');
    const res = await curator.post('/api/v1/releases');
    expect(res.status).toBe(201);
    expect(res.body.version).toMatch(/^\d{4}\.\d{2}\.0$/);
    first = res.body.version;
    const fetched = (await request(t.app).get(`/api/v1/releases/${first}`)).body;
    const recomputed = crypto
      .createHash('sha256')
      .update(canonicalJson(fetched.alloys))
      .digest('hex');
    expect(recomputed).toBe(fetched.checksum);
  });

  it('is in the audit log', async () => {
    const admin = await signedIn(t.app, 'admin');
    const audit = (await admin.get('/api/v1/audit')).body.items;
    expect(
      audit.some(
        (a: { action: string; target: string }) =>
          a.action === 'release.published' && a.target === `release:${first}`,
      ),
    ).toBe(true);
  });

  it('a reader may not publish (403)', async () => {
    expect((await (await signedIn(t.app, 'reader')).post('/api/v1/releases')).status).toBe(403);
  });

  it('never changes after later edits; ?release= returns the old value; the diff and changelog show the change', async () => {
    const curator = await signedIn(t.app, 'curator');
    const admin = await signedIn(t.app, 'admin');
    const before = (await request(t.app).get(`/api/v1/releases/${first}`)).body.checksum;
    const p = await curator.post('/api/v1/revisions').send({
      kind: 'edit',
      alloy: 'gilding-metal-c21000',
      set: { values: { conductivity: { nominal: 32.2e6, min: 31.9e6, max: 33.1e6 } } },
      source: {
        citation: 'Strip certificates 2026 (invented for the test)',
        kind: 'measurement_set',
      },
      reason: 'measured lots',
    });
    await admin
      .post(`/api/v1/revisions/${p.body.id}/review`)
      .send({ decision: 'approve', comment: 'ok' });
    expect(nominal((await request(t.app).get('/api/v1/alloys/gilding-metal-c21000')).body)).toBe(
      32.2e6,
    );
    expect(
      nominal(
        (await request(t.app).get(`/api/v1/alloys/gilding-metal-c21000?release=${first}`)).body,
      ),
    ).toBeCloseTo(32.48e6, 0);
    expect((await request(t.app).get(`/api/v1/releases/${first}`)).body.checksum).toBe(before);
    const listed = (await request(t.app).get(`/api/v1/alloys?q=C21000&release=${first}`)).body
      .items[0];
    expect(listed.conductivitySPerM).toBeCloseTo(32.48e6, 0);

    const second = (await curator.post('/api/v1/releases')).body;
    expect(second.version).toMatch(/\.1$/);
    expect(second.checksum).not.toBe(before);
    expect(second.changelog).toEqual([
      expect.objectContaining({
        revisionId: p.body.id,
        alloy: 'gilding-metal-c21000',
        reason: 'measured lots',
      }),
    ]);
    const diff = (
      await request(t.app).get(`/api/v1/releases/${second.version}/diff?against=${first}`)
    ).body;
    expect(diff.changed).toEqual([
      expect.objectContaining({ alloy: 'gilding-metal-c21000', field: 'values.conductivity' }),
    ]);
    const list = (await request(t.app).get('/api/v1/releases')).body.items;
    expect(list.map((r: { version: string }) => r.version)).toEqual([second.version, first]);
  });

  it('an unknown release → 404', async () => {
    expect((await request(t.app).get('/api/v1/releases/1999.01.0')).status).toBe(404);
    expect((await request(t.app).get('/api/v1/alloys?release=1999.01.0')).status).toBe(404);
  });
});
