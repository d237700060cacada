import fs from 'node:fs';
import os from 'node:os';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { defuse } from '../../backend/routes/curation';
import { signedIn } from '../helpers/access';
import { createTestApp, type TestApp } from '../helpers/test-app';

let t: TestApp;
let curator: Awaited<ReturnType<typeof signedIn>>;
beforeAll(async () => {
  t = await createTestApp({ accounts: true });
  curator = await signedIn(t.app, 'curator');
});
afterAll(() => t.knex.destroy());

const HEADER =
  'slug,name,family,uns,conductivity_iacs,conductivity_min_iacs,conductivity_max_iacs,density_g_cm3,notes';
const upload = (body: Buffer | string, name = 'table.csv') =>
  curator.post('/api/v1/imports').attach('file', Buffer.from(body), name);
const countRevisions = async () =>
  Number(((await t.knex('revisions').count({ n: '*' })) as Array<{ n: number }>)[0]!.n);

function expectRefused(res: request.Response, status: number) {
  expect(res.status, JSON.stringify(res.body)).toBe(status);
  expect(res.type).toBe('application/problem+json');
  expect(res.body.detail).toEqual(expect.any(String));
}

describe('POST /api/v1/imports: a dry run by default', () => {
  it('previews a clean file: what would be created and edited, nothing changed', async () => {
    const csv = `${HEADER}\r\ncartridge-brass-c26000,,,,27.9,27,29,8.53,\r\ntest-token-alloy,Test token alloy,copper,,12.5,,,8.6,invented\r\n`;
    const before = await countRevisions();
    const res = await upload(csv);
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ dryRun: true, kind: 'alloys', rows: 2 });
    expect(res.body.changes.map((c: { action: string }) => c.action)).toEqual(['edit', 'create']);
    expect(await countRevisions()).toBe(before);
  });
  it('names every bad row and field, and imports nothing', async () => {
    const csv = `${HEADER}\r\ngood-one,Good,copper,,50,,,8.9,\r\nBad Slug,,,,abc,,,-1,\r\n`;
    const before = await countRevisions();
    const res = await upload(csv);
    expectRefused(res, 422);
    const paths = res.body.errors.map((e: { path: string }) => e.path);
    expect(paths).toEqual(
      expect.arrayContaining([
        '/file/rows/3/slug',
        '/file/rows/3/conductivity_iacs',
        '/file/rows/3/density_g_cm3',
      ]),
    );
    expect(res.body.errors[0].message).toMatch(/^row 3/);
    expect(await countRevisions()).toBe(before);
  });
  it('applying a clean file makes one pending revision, reviewed as a unit', async () => {
    const res = await curator
      .post('/api/v1/imports')
      .field('apply', 'true')
      .field('citation', 'Supplier certificates 2026 (invented)')
      .field('sourceKind', 'handbook')
      .attach('file', Buffer.from(`${HEADER}\r\nzinc-alloy-5,,,,26.2,25,27,6.7,\r\n`), 'x.csv');
    expect(res.status).toBe(201);
    expect(res.body.revision).toMatchObject({ kind: 'import', status: 'pending' });
  });
  it('applying without a source is refused', async () => {
    const res = await curator
      .post('/api/v1/imports')
      .field('apply', 'true')
      .attach('file', Buffer.from(`${HEADER}\r\nzinc-alloy-5,,,,26.2,25,27,6.7,\r\n`), 'x.csv');
    expectRefused(res, 422);
  });
  it('accepts JSON with the same columns, and a measurement set', async () => {
    const json = JSON.stringify([
      {
        slug: 'lead',
        conductivity_ms_m: 4.8,
        frequency_khz: 60,
        temperature_c: 21,
        uncertainty_percent: 2,
        sample: 'sheet',
        instrument: 'probe',
      },
    ]);
    const res = await upload(json, 'set.json');
    expect(res.status).toBe(200);
    expect(res.body.kind).toBe('measurements');
  });
  it('accepts a byte-order mark and CRLF or LF line ends', async () => {
    expect(
      (await upload(`\uFEFF${HEADER}\r\ngood-two,Good two,copper,,50,,,8.9,\r\n`)).status,
    ).toBe(200);
    expect((await upload(`${HEADER}\ngood-three,Good three,copper,,50,,,8.9,\n`)).status).toBe(200);
  });
});

describe('bad uploads: 4xx with reasons, nothing imported, no temporary files', () => {
  const tmpBefore = fs.readdirSync(os.tmpdir()).length;
  it.each([
    ['truncated (an unclosed quote)', `${HEADER}\r\n"unterminated,row`, 400],
    ['binary', Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x00, 0x01, 0x02]), 415],
    ['wrong columns', 'colour,weight\r\nred,3\r\n', 400],
    ['empty', `${HEADER}\r\n`, 400],
    ['not JSON rows', '{"slug": "x"}', 400],
  ])('%s → %d', async (_name, body, status) => {
    const before = await countRevisions();
    expectRefused(await upload(body as string), status as number);
    expect(await countRevisions()).toBe(before);
  });
  it('oversized (over 20 MiB) → 413', async () => {
    // 4000 rows of 5.3 kB: under the row cap and the record size, over the byte limit.
    const row = `big,${'y'.repeat(5300)},,,,,,,\r\n`;
    expectRefused(await upload(`${HEADER}\r\n${row.repeat(4000)}`), 413);
  });
  it('JSON over 2 MiB → 413 (JSON cannot stream; CSV can)', async () => {
    expectRefused(
      await upload(`[${'{"slug":"x"},'.repeat(200_000)}{"slug":"x"}]`, 'big.json'),
      413,
    );
  });
  it('a record too long to be a row → 400', async () => {
    expectRefused(await upload(`${HEADER}\r\n${'x'.repeat(20_000)}`), 400);
  });
  it('too many rows (over 5000) → 413', async () => {
    const rows = Array.from({ length: 5001 }, (_, i) => `row-${i},R ${i},copper,,50,,,8.9,`).join(
      '\r\n',
    );
    expectRefused(await upload(`${HEADER}\r\n${rows}\r\n`), 413);
  });
  it('streams a large clean CSV (5000 rows, about 0.4 MB) through the row checks', async () => {
    const rows = Array.from(
      { length: 5000 },
      (_, i) => `bulk-${i},Bulk ${i},copper,,50,49,51,8.9,`,
    ).join('\r\n');
    const res = await upload(`${HEADER}\r\n${rows}\r\n`);
    expect(res.status).toBe(200);
    expect(res.body.rows).toBe(5000);
  });
  it('a string in place of the file → 400', async () => {
    expectRefused(
      await curator.post('/api/v1/imports').field('file', `${HEADER}\r\nx,X,copper,,50,,,8.9,`),
      400,
    );
  });
  it('two files → 400', async () => {
    const res = await curator
      .post('/api/v1/imports')
      .attach('file', Buffer.from('a'), 'a.csv')
      .attach('other', Buffer.from('b'), 'b.csv');
    expect(res.status).toBeGreaterThanOrEqual(400);
    expect(res.status).toBeLessThan(500);
  });
  it('left no temporary files behind', () => {
    expect(fs.readdirSync(os.tmpdir()).length).toBeLessThanOrEqual(tmpBefore);
  });
  it('a reader may not import (403)', async () => {
    const reader = await signedIn(t.app, 'reader');
    expect(
      (await reader.post('/api/v1/imports').attach('file', Buffer.from(HEADER), 'a.csv')).status,
    ).toBe(403);
  });
});

describe('GET /api/v1/alloys/export', () => {
  it('downloads RFC 4180 CSV with a filename, in the columns of an import', async () => {
    const res = await request(t.app).get('/api/v1/alloys/export');
    expect(res.status).toBe(200);
    expect(res.type).toBe('text/csv');
    expect(res.headers['content-disposition']).toMatch(
      /attachment; filename="conductory-alloys-\d{4}-\d\d-\d\d\.csv"/,
    );
    expect(res.text.split('\r\n')[0]).toBe(HEADER);
  });
  it('round-trips: an export imports back as edits that change nothing', async () => {
    const csv = (await request(t.app).get('/api/v1/alloys/export')).text;
    const preview = await upload(csv);
    expect(preview.status).toBe(200);
    expect(preview.body.changes.every((c: { action: string }) => c.action === 'edit')).toBe(true);
    const applied = await curator
      .post('/api/v1/imports')
      .field('apply', 'true')
      .field('citation', 'Round-trip test of the export')
      .field('sourceKind', 'handbook')
      .attach('file', Buffer.from(csv), 'export.csv');
    const admin = await signedIn(t.app, 'admin');
    expect(
      (
        await admin
          .post(`/api/v1/revisions/${applied.body.revision.id}/review`)
          .send({ decision: 'approve', comment: 'round trip' })
      ).status,
    ).toBe(200);
    expect(
      await t
        .knex('alloy_history')
        .where({ revision_id: applied.body.revision.id })
        .count({ n: '*' }),
    ).toEqual([{ n: 0 }]);
    expect((await request(t.app).get('/api/v1/alloys/export')).text).toBe(csv);
  });
  it('defuses formula-looking text (OWASP CSV injection) and keeps numbers numbers', async () => {
    const admin = await signedIn(t.app, 'admin');
    const p = await curator.post('/api/v1/revisions').send({
      kind: 'edit',
      alloy: 'lead',
      set: { notes: '=HYPERLINK("http://x.example","click")', name: '+Lead, refined' },
      source: { citation: 'CSV injection test input', kind: 'paper' },
      reason: 'test',
    });
    await admin
      .post(`/api/v1/revisions/${p.body.id}/review`)
      .send({ decision: 'approve', comment: 'test' });
    const line = (await request(t.app).get('/api/v1/alloys/export')).text
      .split('\r\n')
      .find((l) => l.startsWith('lead,'))!;
    expect(line).toContain(`"'+Lead, refined"`);
    expect(line).toContain(`"'=HYPERLINK(""http://x.example"",""click"")"`);
    expect(defuse(-5)).toBe(-5);
    expect(defuse('-5')).toBe("'-5");
    expect(defuse('@SUM(A1)')).toBe("'@SUM(A1)");
  });
  it('JSON too, with a filename', async () => {
    const res = await request(t.app).get('/api/v1/alloys/export?format=json');
    expect(res.headers['content-disposition']).toMatch(/\.json"/);
    expect(res.body.items.length).toBeGreaterThan(45);
  });
  it('offers import templates', async () => {
    const res = await request(t.app).get('/api/v1/imports/template?kind=measurements');
    expect(res.text.split('\r\n')[0]).toBe(
      'slug,conductivity_ms_m,frequency_khz,temperature_c,uncertainty_percent,sample,instrument',
    );
    expect((await upload(res.text)).status).toBe(200);
  });
});
