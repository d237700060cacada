import http from 'node:http';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import {
  BATCH_PLAN_CSV_COLUMNS,
  type BatchPlanClassified,
  type BatchPlanLine,
} from '../../shared/match/batch-results';
import { signedIn } from '../helpers/access';
import { createTestApp, type TestApp } from '../helpers/test-app';

let t: TestApp;
let integrator: Awaited<ReturnType<typeof signedIn>>;
beforeAll(async () => {
  t = await createTestApp({ accounts: true });
  integrator = await signedIn(t.app, 'integrator');
});
afterAll(() => t.knex.destroy());

const URL = '/api/v1/match/batch';
const HEADER = 'id,conductivity (MS/m),temperature (C),frequency (kHz)';
const mm = (value: number) => ({ value, unit: 'mm' });
const kHz = (value: number) => ({ value, unit: 'kHz' });
const celsius = (value: number) => ({ value, unit: '°C' });

/** Solid products over two frequencies, 15–35 °C, one lift-off (as tests/api/sort-plans). */
const plan = (products: Array<{ name: string; alloy: string }>) => ({
  products,
  coil: { innerRadius: mm(1.5), outerRadius: mm(3), length: mm(2), turns: 100 },
  frequencies: [kHz(10), kHz(100)],
  liftOff: { min: mm(0.5), max: mm(0.5) },
  temperature: { min: celsius(15), max: celsius(35) },
  method: { kind: 'interval' },
});

type Saved = {
  id: number;
  release: { version: string; checksum: string };
  result: {
    frequencies: Array<{
      frequencyHz: number;
      windows: Array<{ product: string; lowSPerM: number; highSPerM: number }>;
    }>;
    recommendedFrequencyHz: number | null;
  };
};

async function save(
  agent: typeof integrator,
  name: string,
  products: Array<{ name: string; alloy: string }>,
): Promise<Saved> {
  const res = await agent.post('/api/v1/sort-plans').send({ name, plan: plan(products) });
  expect(res.status, JSON.stringify(res.body)).toBe(201);
  return res.body as Saved;
}

/** Reads any answer body as text (superagent buffers only the text types it knows). */
const asText = (res: http.IncomingMessage, callback: (e: Error | null, body: string) => void) => {
  let text = '';
  res.setEncoding('utf8');
  res.on('data', (chunk: string) => (text += chunk));
  res.on('end', () => callback(null, text));
};

const postCsv = (
  id: number,
  csv: string,
  accept = 'application/x-ndjson',
  agent: typeof integrator = integrator,
) =>
  agent
    .post(`${URL}?plan=${id}`)
    .set('Content-Type', 'text/csv')
    .set('Accept', accept)
    .buffer(true)
    .parse(asText as never)
    .send(Buffer.from(csv));

const ndjson = (text: string) =>
  text
    .trimEnd()
    .split('\n')
    .map((l) => JSON.parse(l) as BatchPlanLine);

/** MS/m, to nine significant figures: inside a window when the window is wider than that. */
const ms = (sPerM: number) => Number((sPerM / 1e6).toPrecision(9));
const middle = (w: { lowSPerM: number; highSPerM: number }) => (w.lowSPerM + w.highSPerM) / 2;

describe('POST /api/v1/match/batch?plan=', () => {
  let separated: Saved;
  beforeAll(async () => {
    separated = await save(integrator, 'copper and stainless', [
      { name: 'copper', alloy: 'copper-c11000' },
      { name: 'stainless', alloy: 'stainless-304' },
    ]);
  });

  const at = (frequencyHz: number) =>
    separated.result.frequencies.find((f) => f.frequencyHz === frequencyHz)!;
  const windowOf = (frequencyHz: number, product: string) =>
    at(frequencyHz).windows.find((w) => w.product === product)!;

  it('copper, stainless, between them → product, product, none (NDJSON), with the release in headers', async () => {
    const copper = windowOf(1e4, 'copper');
    const stainless = windowOf(1e4, 'stainless');
    // Well separated: ~100 %IACS against ~2.5 %IACS.
    expect(stainless.highSPerM).toBeLessThan(copper.lowSPerM);
    const between = Math.sqrt(stainless.highSPerM * copper.lowSPerM);
    const csv = [
      HEADER,
      `cu,${ms(middle(copper))},20,12`,
      `ss,${ms(middle(stainless))},20,8`,
      `gap,${ms(between)},20,10`,
      '',
    ].join('\r\n');
    const res = await postCsv(separated.id, csv);
    expect(res.status, res.body as string).toBe(200);
    expect(res.type).toBe('application/x-ndjson');
    expect(res.headers['x-batch-rows']).toBe('3');
    expect(res.headers['x-plan-release']).toBe(separated.release.version);
    expect(res.headers['x-plan-release-checksum']).toBe(separated.release.checksum);
    const lines = ndjson(res.body as string);
    expect(lines.map((l) => [l.row, l.id, l.status])).toEqual([
      [2, 'cu', 'product'],
      [3, 'ss', 'product'],
      [4, 'gap', 'none'],
    ]);
    const [cu, ss, gap] = lines as Array<BatchPlanClassified>;
    expect(cu!.product).toBe('copper');
    expect(cu!.products).toEqual(['copper']);
    expect(ss!.product).toBe('stainless');
    expect(gap!.product).toBeNull();
    expect(gap!.products).toEqual([]);
    // 12 kHz and 8 kHz are nearest 10 kHz in log terms (not 100 kHz).
    for (const l of [cu!, ss!, gap!]) {
      expect(l.planFrequencyHz).toBe(1e4);
      expect(l.frequencyFrom).toBe('reading');
      expect(l.notes).toEqual([]);
    }
  });

  it('the frequency: nearest in log terms, or the recommended one when the row gives none', async () => {
    // 40 kHz: |ln(40/10)| = 1.39 > |ln(100/40)| = 0.92, so 100 kHz, though 40 is nearer 10 in Hz.
    const copper = windowOf(1e5, 'copper');
    const csv = [HEADER, `a,${ms(middle(copper))},20,40`, `b,${ms(middle(copper))},20,`, ''].join(
      '\r\n',
    );
    const lines = ndjson(
      (await postCsv(separated.id, csv)).body as string,
    ) as Array<BatchPlanClassified>;
    expect(lines[0]!.planFrequencyHz).toBe(1e5);
    expect(lines[0]!.frequencyFrom).toBe('reading');
    expect(lines[1]!.planFrequencyHz).toBe(separated.result.recommendedFrequencyHz);
    expect(lines[1]!.frequencyFrom).toBe('recommended');
    expect(lines[1]!.reading.frequencyHz).toBeNull();
  });

  it('a reading outside the plan’s temperature range → classified, with a note', async () => {
    const copper = windowOf(1e4, 'copper');
    const csv = [HEADER, `hot,${ms(middle(copper))},80,10`, ''].join('\r\n');
    const [line] = ndjson(
      (await postCsv(separated.id, csv)).body as string,
    ) as Array<BatchPlanClassified>;
    expect(line!.status).toBe('product');
    expect(line!.notes).toEqual([
      "temperature 80 °C is outside the plan's 15 °C to 35 °C, which its windows span",
    ]);
  });

  it('CSV: the classification columns; a bad row keeps its row number and the rest go on', async () => {
    const copper = windowOf(1e4, 'copper');
    const csv = [
      HEADER,
      `cu,${ms(middle(copper))},20,10`,
      'bad,lots,20,10',
      `gap,1,20,10`,
      '',
    ].join('\r\n');
    const res = await postCsv(separated.id, csv, 'text/csv');
    expect(res.status).toBe(200);
    expect(res.type).toBe('text/csv');
    expect(res.headers['x-batch-errors']).toBe('1');
    expect(res.headers['content-disposition']).toMatch(/conductory-sort-results\.csv/);
    const [head, ...records] = (res.body as string).trimEnd().split('\r\n');
    expect(head).toBe(BATCH_PLAN_CSV_COLUMNS.join(','));
    const rows = records.map((r) =>
      Object.fromEntries(r.split(',').map((v, i) => [BATCH_PLAN_CSV_COLUMNS[i]!, v])),
    );
    expect(rows.map((r) => [r.row, r.id, r.status, r.product])).toEqual([
      ['2', 'cu', 'product', 'copper'],
      ['3', 'bad', 'error', ''],
      ['4', 'gap', 'none', ''],
    ]);
    expect(rows[1]!.error).toMatch(/conductivity 'lots' is not a number/);
    expect(rows[0]!.plan_frequency_hz).toBe('10000');
    expect(rows[0]!.frequency_from).toBe('reading');
  });

  it('two products of overlapping windows → ambiguous, naming both', async () => {
    const twins = await save(integrator, 'twins', [
      { name: 'copper A', alloy: 'copper-c11000' },
      { name: 'copper B', alloy: 'copper-c11000' },
    ]);
    const w = twins.result.frequencies[0]!.windows[0]!;
    const csv = [HEADER, `x,${ms(middle(w))},20,10`, ''].join('\r\n');
    const [line] = ndjson(
      (await postCsv(twins.id, csv)).body as string,
    ) as Array<BatchPlanClassified>;
    expect(line!.status).toBe('ambiguous');
    expect(line!.product).toBeNull();
    expect(line!.products).toEqual(['copper A', 'copper B']);
    const res = await postCsv(twins.id, csv, 'text/csv');
    expect(res.body as string).toMatch(/,ambiguous,.*,copper A; copper B,/);
  });

  it('another person’s plan, or a missing one → 404 problem+json, before the body is read', async () => {
    const curator = await signedIn(t.app, 'curator');
    for (const res of [
      await postCsv(separated.id, `${HEADER}\r\nx,50,20,10\r\n`, 'text/csv', curator),
      await postCsv(999_999, `${HEADER}\r\nx,50,20,10\r\n`),
    ]) {
      expect(res.status).toBe(404);
      expect(res.type).toBe('application/problem+json');
      expect(JSON.parse(res.body as string).detail).toMatch(/No sort plan \d+ of yours/);
    }
  });

  it('a reader (no batch Match) → 403; a visitor → 401', async () => {
    const reader = await signedIn(t.app, 'reader');
    const res = await postCsv(separated.id, `${HEADER}\r\nx,50,20,10\r\n`, 'text/csv', reader);
    expect(res.status).toBe(403);
    const anon = await request(t.app)
      .post(`${URL}?plan=${separated.id}`)
      .set('Content-Type', 'text/csv')
      .send(`${HEADER}\r\nx,50,20,10\r\n`);
    expect(anon.status).toBe(401);
  });
});
