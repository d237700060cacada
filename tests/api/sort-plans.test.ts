import { execFileSync } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { parse } from 'csv-parse/sync';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Express } from 'express';
import type { Knex } from 'knex';
import { createTestApp } from '../helpers/test-app';
import { signedIn } from '../helpers/access';

let app: Express;
let knex: Knex;
beforeAll(async () => ({ app, knex } = await createTestApp({ accounts: true })));
afterAll(() => knex.destroy());

const mm = (value: number) => ({ value, unit: 'mm' });
const kHz = (value: number) => ({ value, unit: 'kHz' });
const celsius = (value: number) => ({ value, unit: '°C' });
const COIL = { innerRadius: mm(1.5), outerRadius: mm(3), length: mm(2), turns: 100 };
const COINS = [
  'estmark-1-mark',
  'estmark-2-marks',
  'estmark-5-marks',
  'estmark-10-marks',
  'estmark-20-marks',
];

/** The five demo coins (seeds/demo/estmark.ts) over a small sweep. */
const coinsPlan = (extra: Record<string, unknown> = {}) => ({
  products: COINS.map((slug) => ({ name: slug.replace('estmark-', ''), stack: slug })),
  coil: COIL,
  frequencies: { from: kHz(1), to: kHz(300), points: 8 },
  liftOff: { min: mm(0.5), max: mm(0.5) },
  temperature: { min: celsius(15), max: celsius(35) },
  tolerances: { platingThicknessPercent: 10 },
  method: { kind: 'interval' },
  ...extra,
});

function expectProblem(res: request.Response, status: number, path?: string) {
  expect(res.status, JSON.stringify(res.body)).toBe(status);
  expect(res.type).toBe('application/problem+json');
  if (path) expect(res.body.errors.map((e: { path: string }) => e.path)).toContain(path);
}

describe('POST /api/v1/sort-plans/evaluate', () => {
  it('integrator, the demo coins → windows per frequency, a recommended frequency and pair', async () => {
    const agent = await signedIn(app, 'integrator');
    const res = await agent.post('/api/v1/sort-plans/evaluate').send(coinsPlan());
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    expect(res.type).toBe('application/json');
    expect(res.body.release.version).toBe('unreleased');
    expect(res.body.release.checksum).toMatch(/^[0-9a-f]{64}$/);
    expect(res.body.warnings.map((w: { code: string }) => w.code)).toContain('unreleased-table');
    // 2 marks is copper-plated steel (product.md): magnetic.
    expect(res.body.warnings.map((w: { code: string }) => w.code)).toContain('magnetic-layer');
    expect(res.body.frequencies).toHaveLength(8);
    for (const f of res.body.frequencies) {
      expect(f.windows).toHaveLength(5);
      for (const w of f.windows) {
        expect(w.lowSPerM).toBeLessThanOrEqual(w.highSPerM);
        // %IACS = σ / 58 MS/m × 100 (IEC 60028, physics.md)
        expect(w.lowPercentIacs).toBeCloseTo((w.lowSPerM / 58e6) * 100, 9);
      }
    }
    const best = Math.max(
      ...res.body.frequencies.map((f: { separability: number }) => f.separability),
    );
    const at = res.body.frequencies.find(
      (f: { frequencyHz: number }) => f.frequencyHz === res.body.recommendedFrequencyHz,
    );
    expect(at.separability).toBe(best);
    expect(res.body.recommendedPair).toHaveLength(2);
  });

  it('visitor → a small plan runs; a large one is refused with a clear 422', async () => {
    const small = await request(app)
      .post('/api/v1/sort-plans/evaluate')
      .send(coinsPlan({ frequencies: [kHz(10)] }));
    expect(small.status, JSON.stringify(small.body)).toBe(200);
    const large = await request(app)
      .post('/api/v1/sort-plans/evaluate')
      .send(coinsPlan({ frequencies: { from: kHz(1), to: kHz(300), points: 40 } }));
    expectProblem(large, 422, '/body/frequencies');
    expect(large.body.detail).toMatch(/at most 16/);
  });

  it('huge sample counts → 400 naming the field and the limit', async () => {
    const agent = await signedIn(app, 'integrator');
    const res = await agent
      .post('/api/v1/sort-plans/evaluate')
      .send(coinsPlan({ method: { kind: 'monteCarlo', samples: 10_000_000, seed: 1 } }));
    expectProblem(res, 400, '/body/method/samples');
    expect(JSON.stringify(res.body)).toMatch(/5000/);
  });

  it('too many readings in all → 422 with the count', async () => {
    const agent = await signedIn(app, 'integrator');
    const res = await agent.post('/api/v1/sort-plans/evaluate').send(
      coinsPlan({
        frequencies: { from: kHz(1), to: kHz(300), points: 64 },
        method: { kind: 'monteCarlo', samples: 5000, seed: 1 },
      }),
    );
    expectProblem(res, 422, '/body');
    expect(res.body.detail).toMatch(/1,600,000 readings/);
  });

  it.each([
    ['an unknown field', coinsPlan({ colour: 'red' }), '/body/colour'],
    [
      'an unknown unit',
      coinsPlan({ liftOff: { min: mm(0.5), max: { value: 1, unit: 'ft' } } }),
      '/body/liftOff/max/unit',
    ],
    [
      'an unknown alloy',
      coinsPlan({ products: [{ name: 'x', alloy: 'unobtainium' }] }),
      '/body/products/0/alloy',
    ],
    [
      'an unknown stack',
      coinsPlan({ products: [{ name: 'x', stack: 'estmark-3-marks' }] }),
      '/body/products/0/stack',
    ],
    [
      'a name twice',
      coinsPlan({
        products: [
          { name: 'x', alloy: 'lead' },
          { name: 'x', alloy: 'zinc-shg' },
        ],
      }),
      '/body/products/1/name',
    ],
    [
      'lift-off max below min',
      coinsPlan({ liftOff: { min: mm(0.5), max: mm(0.2) } }),
      '/body/liftOff/max',
    ],
    [
      'a sweep that ends below its start',
      coinsPlan({ frequencies: { from: kHz(10), to: kHz(1), points: 4 } }),
      '/body/frequencies/to',
    ],
    ['no method', { ...coinsPlan(), method: undefined }, '/body/method'],
  ])('%s → 400 problem+json', async (_name, body, field) => {
    const agent = await signedIn(app, 'integrator');
    const res = await agent.post('/api/v1/sort-plans/evaluate').send(body as object);
    expectProblem(res, 400);
    expect(JSON.stringify(res.body.errors)).toContain(field.split('/').slice(0, 4).join('/'));
  });

  it('a temperature far from room → 422 naming the field', async () => {
    const agent = await signedIn(app, 'integrator');
    const res = await agent
      .post('/api/v1/sort-plans/evaluate')
      .send(coinsPlan({ temperature: { min: celsius(20), max: celsius(600) } }));
    expectProblem(res, 422, '/body/temperature/max');
  });

  it("a solid alloy's low-frequency window is its table range (interval, one lift-off, 20 °C)", async () => {
    const agent = await signedIn(app, 'integrator');
    const res = await agent.post('/api/v1/sort-plans/evaluate').send({
      products: [{ name: 'brass', alloy: 'cartridge-brass-c26000' }],
      coil: COIL,
      frequencies: [{ value: 50, unit: 'Hz' }],
      liftOff: { min: mm(0.5), max: mm(0.5) },
      temperature: { min: celsius(20), max: celsius(20) },
      method: { kind: 'interval' },
    });
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    const alloy = await request(app).get('/api/v1/alloys/cartridge-brass-c26000');
    const c = alloy.body.values.find((v: { quantity: string }) => v.quantity === 'conductivity');
    const w = res.body.frequencies[0].windows[0];
    // The table's own min–max for C26000 (seeds/reference/alloys-copper.ts, its cited source).
    expect(w.lowSPerM / c.min).toBeCloseTo(1, 5);
    expect(w.highSPerM / c.max).toBeCloseTo(1, 5);
  });
});

describe('saved plans and their exports', () => {
  let id: number;
  let agent: Awaited<ReturnType<typeof signedIn>>;
  beforeAll(async () => {
    agent = await signedIn(app, 'integrator');
    const res = await agent
      .post('/api/v1/sort-plans')
      .send({ name: 'Estmark "coins"?', plan: coinsPlan() });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    id = res.body.id;
    expect(res.body.resultSha256).toMatch(/^[0-9a-f]{64}$/);
  });

  it('GET list and one → the owner sees it; another integrator-level account gets 404', async () => {
    const list = await agent.get('/api/v1/sort-plans');
    expect(list.status).toBe(200);
    expect(list.body.items.map((p: { id: number }) => p.id)).toContain(id);
    const one = await agent.get(`/api/v1/sort-plans/${id}`);
    expect(one.status).toBe(200);
    expect(one.body.result.frequencies).toHaveLength(8);
    const curator = await signedIn(app, 'curator');
    expectProblem(await curator.get(`/api/v1/sort-plans/${id}`), 404);
    expectProblem(await curator.get(`/api/v1/sort-plans/${id}/export?format=c`), 404);
    expectProblem(await curator.delete(`/api/v1/sort-plans/${id}`), 404);
  });

  it('reader and visitor → 403 and 401', async () => {
    const reader = await signedIn(app, 'reader');
    expectProblem(await reader.get('/api/v1/sort-plans'), 403);
    expectProblem(await request(app).get(`/api/v1/sort-plans/${id}`), 401);
  });

  it('exports are byte-identical twice and carry the release', async () => {
    for (const format of ['json', 'csv', 'c']) {
      const a = await agent.get(`/api/v1/sort-plans/${id}/export?format=${format}`).buffer(true);
      const b = await agent.get(`/api/v1/sort-plans/${id}/export?format=${format}`).buffer(true);
      expect(a.status).toBe(200);
      const text = a.text ?? a.body.toString();
      expect(text).toBe(b.text ?? b.body.toString());
      expect(text).toContain('unreleased');
      expect(a.headers['content-disposition']).toMatch(/attachment; filename="conductory-plan-/);
    }
    expectProblem(await agent.get(`/api/v1/sort-plans/${id}/export?format=pdf`), 400);
    expectProblem(await agent.get(`/api/v1/sort-plans/${id}/export`), 400);
  });

  it('CSV round-trips: parsed back, every window equals the JSON result', async () => {
    const csv = (await agent.get(`/api/v1/sort-plans/${id}/export?format=csv`).buffer(true)).text;
    const rows = parse(csv, { columns: true }) as Array<Record<string, string>>;
    const plan = (await agent.get(`/api/v1/sort-plans/${id}`)).body;
    const expected = plan.result.frequencies.flatMap(
      (f: { frequencyHz: number; windows: Array<Record<string, number | string>> }) =>
        f.windows.map((w) => [f.frequencyHz, w.product, w.lowSPerM, w.highSPerM]),
    );
    expect(
      rows.map((r) => [
        Number(r.frequency_hz),
        r.product,
        Number(r.low_s_per_m),
        Number(r.high_s_per_m),
      ]),
    ).toEqual(expected);
    expect(new Set(rows.map((r) => r.result_sha256))).toEqual(new Set([plan.resultSha256]));
  });

  it('the C header compiles with gcc -std=c99 -Wall -Wextra -Werror and classifies three readings', async () => {
    const header = (await agent.get(`/api/v1/sort-plans/${id}/export?format=c`).buffer(true)).text;
    const plan = (await agent.get(`/api/v1/sort-plans/${id}`)).body;
    const fi = plan.result.frequencies.findIndex(
      (f: { frequencyHz: number }) => f.frequencyHz === plan.result.recommendedFrequencyHz,
    );
    const windows = plan.result.frequencies[fi].windows as Array<{
      lowPercentIacs: number;
      highPercentIacs: number;
    }>;
    // Expected answers computed from the JSON result the header was made from.
    const classify = (x: number) => {
      const hits = windows.flatMap((w, p) =>
        x >= w.lowPercentIacs && x <= w.highPercentIacs ? [p] : [],
      );
      return hits.length === 0 ? -1 : hits.length > 1 ? -2 : hits[0]!;
    };
    const readings = [
      (windows[2]!.lowPercentIacs + windows[2]!.highPercentIacs) / 2,
      (windows[0]!.lowPercentIacs + windows[0]!.highPercentIacs) / 2,
      500,
    ];
    const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'conductory-header-'));
    try {
      fs.writeFileSync(path.join(dir, 'conductory_plan.h'), header);
      fs.writeFileSync(
        path.join(dir, 'main.c'),
        `#include <stdio.h>
#include "conductory_plan.h"
int main(void)
{
    const double readings[3] = { ${readings.map((r) => r.toPrecision(17)).join(', ')} };
    int i;
    for (i = 0; i < 3; i++)
        printf("%d\\n", conductory_plan_classify(${fi}, readings[i]));
    printf("%s %d\\n", CONDUCTORY_PLAN_RELEASE_VERSION, CONDUCTORY_PLAN_RECOMMENDED_INDEX);
    printf("%s\\n", conductory_plan_product_name[0]);
    printf("%s\\n", CONDUCTORY_PLAN_NAME);
    return 0;
}
`,
      );
      // Debian's gcc (.ci/run installs it when missing).
      execFileSync(
        '/usr/bin/gcc',
        ['-std=c99', '-Wall', '-Wextra', '-Werror', '-pedantic', '-o', 'classify', 'main.c'],
        { cwd: dir },
      );
      const out = execFileSync(path.join(dir, 'classify'), { encoding: 'utf8' }).trim().split('\n');
      expect(out.slice(0, 3).map(Number)).toEqual(readings.map(classify));
      expect(out[3]).toBe(`unreleased ${fi}`);
      expect(out[4]).toBe('1-mark');
      expect(out[5]).toBe('Estmark "coins"?');
    } finally {
      fs.rmSync(dir, { recursive: true, force: true });
    }
  });

  it('re-evaluate against a newly published release → from/to versions and what moved', async () => {
    const curator = await signedIn(app, 'curator');
    const published = await curator.post('/api/v1/releases');
    expect(published.status).toBe(201);
    const res = await agent.post(`/api/v1/sort-plans/${id}/re-evaluate`).send({});
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    expect(res.body.from.version).toBe('unreleased');
    expect(res.body.to.version).toBe(published.body.version);
    // The release froze the same table the plan read live: nothing moves, and the checksum the
    // unreleased plan carried is the release's (same canonical JSON).
    expect(res.body.moved).toEqual([]);
    expect(res.body.to.checksum).toBe(res.body.from.checksum);
    expect(res.body.recommendedFrequencyHz.to).toBe(res.body.recommendedFrequencyHz.from);
    expectProblem(
      await agent.post(`/api/v1/sort-plans/${id}/re-evaluate`).send({ release: '2099.01.0' }),
      400,
      '/body/release',
    );
  });

  it('release export: byte-identical, C compiles and finds an alloy, CSV parses', async () => {
    const version = (await request(app).get('/api/v1/releases')).body.items[0].version;
    const get = (format: string) =>
      agent.get(`/api/v1/releases/${version}/export?format=${format}`).buffer(true);
    for (const format of ['json', 'csv', 'c']) {
      const [a, b] = [await get(format), await get(format)];
      expect(a.status).toBe(200);
      expect(a.text).toBe(b.text);
      expect(a.text).toContain(version);
    }
    const rows = parse((await get('csv')).text, { columns: true }) as Array<Record<string, string>>;
    const copper = rows.find((r) => r.slug === 'copper-c11000')!;
    expect(Number(copper.conductivity_percent_iacs)).toBeCloseTo(
      (Number(copper.conductivity_s_per_m) / 58e6) * 100,
      9,
    );
    const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'conductory-table-'));
    try {
      fs.writeFileSync(path.join(dir, 'conductory_table.h'), (await get('c')).text);
      fs.writeFileSync(
        path.join(dir, 'main.c'),
        `#include <stdio.h>
#include "conductory_table.h"
int main(void)
{
    int a = conductory_table_find(${Number(copper.conductivity_percent_iacs)}, 0);
    printf("%s\\n", a < 0 ? "none" : conductory_table_slug[a]);
    return 0;
}
`,
      );
      execFileSync(
        '/usr/bin/gcc',
        ['-std=c99', '-Wall', '-Wextra', '-Werror', '-o', 'find', 'main.c'],
        { cwd: dir },
      );
      const found = execFileSync(path.join(dir, 'find'), { encoding: 'utf8' }).trim();
      // Some alloy's range holds copper's nominal reading: copper's own or a neighbour's.
      expect(rows.map((r) => r.slug)).toContain(found);
    } finally {
      fs.rmSync(dir, { recursive: true, force: true });
    }
    const visitor = await request(app).get(`/api/v1/releases/${version}/export?format=c`);
    expectProblem(visitor, 401);
  });

  it('DELETE → 204, then 404', async () => {
    expect((await agent.delete(`/api/v1/sort-plans/${id}`)).status).toBe(204);
    expectProblem(await agent.get(`/api/v1/sort-plans/${id}`), 404);
  });
});
