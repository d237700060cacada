import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { demo, signedIn } from '../helpers/access';
import { createTestApp, type TestApp } from '../helpers/test-app';

let t: TestApp;
beforeAll(async () => (t = await createTestApp({ accounts: true })));
afterAll(() => t.knex.destroy());

const source = {
  citation: 'Mill test certificate, strip lot 4471 (invented for the test)',
  kind: 'measurement_set' as const,
  locator: 'sheet 2',
};
const editC26000 = (nominal: number) => ({
  kind: 'edit',
  alloy: 'cartridge-brass-c26000',
  set: { values: { conductivity: { nominal, min: 15.66e6, max: 16.82e6 } } },
  source,
  reason: 'Lot measurements read 27.6 %IACS on average',
});
const conductivityOf = async (slug: string, query = '') =>
  (await request(t.app).get(`/api/v1/alloys/${slug}${query}`)).body.values.find(
    (v: { quantity: string }) => v.quantity === 'conductivity',
  ).nominal as number;
const outbox = async (email: string) =>
  (
    await (
      await signedIn(t.app, 'admin')
    ).get(`/api/v1/admin/outbox?to=${encodeURIComponent(email)}`)
  ).body.items as Array<{ template: string; subject: string }>;

describe('POST /api/v1/revisions', () => {
  it.each(['reader', 'integrator'] as const)('%s may not propose (403)', async (role) => {
    const agent = await signedIn(t.app, role);
    expect((await agent.post('/api/v1/revisions').send(editC26000(16.0e6))).status).toBe(403);
  });
  it('a change without a source is refused', async () => {
    const curator = await signedIn(t.app, 'curator');
    const { source: _s, ...noSource } = editC26000(16.0e6);
    const res = await curator.post('/api/v1/revisions').send(noSource);
    expect(res.status).toBe(400);
    expect(res.body.detail).toMatch(/source/);
  });
  it('values out of order are refused (422 naming the field)', async () => {
    const curator = await signedIn(t.app, 'curator');
    const res = await curator.post('/api/v1/revisions').send({ ...editC26000(20e6) });
    expect(res.status).toBe(422);
    expect(res.body.errors[0].path).toBe('/body/set/values/conductivity/max');
  });
});

describe('two-person review', () => {
  let id = 0;
  it('a curator proposes → 201 pending, and the other curators are mailed', async () => {
    const a = await signedIn(t.app, 'curator');
    const res = await a.post('/api/v1/revisions').send(editC26000(16.0e6));
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({
      status: 'pending',
      author: demo('curator').email,
      alloy: 'cartridge-brass-c26000',
    });
    expect(res.body.before.values.conductivity.nominal).toBeCloseTo(16.24e6, 0);
    id = res.body.id;
    expect(
      (await outbox('curator2@carrowbay.example')).some((m) => m.template === 'review-requested'),
    ).toBe(true);
    expect(await conductivityOf('cartridge-brass-c26000')).toBeCloseTo(16.24e6, 0);
  });
  it('the author may not review their own change (403)', async () => {
    const a = await signedIn(t.app, 'curator');
    expect(
      (
        await a
          .post(`/api/v1/revisions/${id}/review`)
          .send({ decision: 'approve', comment: 'fine by me' })
      ).status,
    ).toBe(403);
  });
  it('a second curator approves: applied, with a history row naming both, and the author is mailed', async () => {
    const b = await signedIn(t.app, {
      email: demo('curator').email.replace('curator@', 'curator2@'),
      password: 'curator2-demo-2026',
    });
    const res = await b
      .post(`/api/v1/revisions/${id}/review`)
      .send({ decision: 'approve', comment: 'certificates checked' });
    expect(res.status).toBe(200);
    expect(res.body.status).toBe('approved');
    expect(await conductivityOf('cartridge-brass-c26000')).toBe(16.0e6);
    const history = (await request(t.app).get('/api/v1/alloys/cartridge-brass-c26000/history')).body
      .items;
    expect(history[0]).toMatchObject({
      revisionId: id,
      field: 'values.conductivity',
      proposedBy: 'curator@carrowbay.example',
      approvedBy: 'curator2@carrowbay.example',
      reason: 'Lot measurements read 27.6 %IACS on average',
      newValue: { nominal: 16.0e6 },
      source: { citation: source.citation, kind: 'measurement_set' },
    });
    expect(history[0].oldValue.nominal).toBeCloseTo(16.24e6, 0);
    expect(
      (await outbox('curator@carrowbay.example')).some((m) => m.template === 'review-decided'),
    ).toBe(true);
    const detail = (await request(t.app).get('/api/v1/alloys/cartridge-brass-c26000')).body;
    expect(
      detail.values.find((v: { quantity: string }) => v.quantity === 'conductivity').source
        .citation,
    ).toBe(source.citation);
  });
  it('a reviewed revision cannot be reviewed again (409)', async () => {
    const b = await signedIn(t.app, 'admin');
    expect(
      (
        await b
          .post(`/api/v1/revisions/${id}/review`)
          .send({ decision: 'reject', comment: 'too late' })
      ).status,
    ).toBe(409);
  });
  it('a rejected proposal changes nothing and writes no history', async () => {
    const a = await signedIn(t.app, 'curator');
    const proposal = await a.post('/api/v1/revisions').send({
      kind: 'edit',
      alloy: 'red-brass-c23000',
      set: { notes: 'rejected note' },
      source,
      reason: 'test',
    });
    const b = await signedIn(t.app, 'admin');
    expect(
      (
        await b
          .post(`/api/v1/revisions/${proposal.body.id}/review`)
          .send({ decision: 'reject', comment: 'no source for this' })
      ).body.status,
    ).toBe('rejected');
    expect((await request(t.app).get('/api/v1/alloys/red-brass-c23000')).body.notes).toBeNull();
    expect(
      (await request(t.app).get('/api/v1/alloys/red-brass-c23000/history')).body.items,
    ).toEqual([]);
  });
  it('creates and retires alloys through review', async () => {
    const a = await signedIn(t.app, 'curator');
    const b = await signedIn(t.app, 'admin');
    const created = await a.post('/api/v1/revisions').send({
      kind: 'create',
      alloy: 'token-bronze-test',
      set: {
        name: 'Token bronze (test)',
        family: 'copper',
        values: { conductivity: { nominal: 10e6 }, density: { nominal: 8800 } },
      },
      source,
      reason: 'new token alloy',
    });
    expect(created.status).toBe(201);
    await b
      .post(`/api/v1/revisions/${created.body.id}/review`)
      .send({ decision: 'approve', comment: 'ok' });
    expect((await request(t.app).get('/api/v1/alloys/token-bronze-test')).status).toBe(200);
    const retired = await a
      .post('/api/v1/revisions')
      .send({ kind: 'retire', alloy: 'token-bronze-test', set: {}, source, reason: 'withdrawn' });
    await b
      .post(`/api/v1/revisions/${retired.body.id}/review`)
      .send({ decision: 'approve', comment: 'ok' });
    expect((await request(t.app).get('/api/v1/alloys/token-bronze-test')).status).toBe(404);
  });
});

describe('one transaction per approval', () => {
  it('a failure midway leaves no change and no history row; the revision stays pending', async () => {
    const a = await signedIn(t.app, 'curator');
    const csv =
      'slug,conductivity_ms_m,frequency_khz,temperature_c,uncertainty_percent,sample,instrument\r\nlead,4.8,60,20,2,lead sheet,probe A\r\ntin,8.7,60,20,2,tin ingot,probe A\r\n';
    const res = await a
      .post('/api/v1/imports')
      .field('apply', 'true')
      .field('citation', 'Bench measurements, line 2 (invented)')
      .field('sourceKind', 'measurement_set')
      .attach('file', Buffer.from(csv), 'set.csv');
    expect(res.status).toBe(201);
    const revisionId = res.body.revision.id;
    // The second row's alloy disappears before the review (as if removed meanwhile).
    await t.knex('alloys').where({ slug: 'tin' }).update({ slug: 'tin-renamed' });
    const b = await signedIn(t.app, 'admin');
    const review = await b
      .post(`/api/v1/revisions/${revisionId}/review`)
      .send({ decision: 'approve', comment: 'go' });
    expect(review.status).toBe(409);
    expect(await t.knex('measurements').count({ n: '*' })).toEqual([{ n: 0 }]);
    expect(
      await t.knex('alloy_history').where({ revision_id: revisionId }).count({ n: '*' }),
    ).toEqual([{ n: 0 }]);
    expect((await b.get(`/api/v1/revisions/${revisionId}`)).body.status).toBe('pending');
    await t.knex('alloys').where({ slug: 'tin-renamed' }).update({ slug: 'tin' });
    expect(
      (
        await b
          .post(`/api/v1/revisions/${revisionId}/review`)
          .send({ decision: 'approve', comment: 'again' })
      ).status,
    ).toBe(200);
    const lead = (await request(t.app).get('/api/v1/alloys/lead')).body;
    expect(lead.measurements[0]).toMatchObject({ conductivitySPerM: 4.8e6, sample: 'lead sheet' });
  });
});
