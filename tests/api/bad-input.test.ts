import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Express } from 'express';
import type { Knex } from 'knex';
import { createTestApp } from '../helpers/test-app';

let app: Express;
let knex: Knex;
beforeAll(async () => ({ app, knex } = await createTestApp()));
afterAll(() => knex.destroy());

/** Every bad request gets a 4xx problem+json that says what is wrong, never a 500. */
function expectProblem(res: request.Response, status: number, path?: string) {
  expect(res.status, JSON.stringify(res.body)).toBe(status);
  expect(res.type).toBe('application/problem+json');
  expect(res.body.status).toBe(status);
  expect(res.body.title).toEqual(expect.any(String));
  expect(res.body.detail).toEqual(expect.any(String));
  if (path) expect(res.body.errors.map((e: { path: string }) => e.path)).toContain(path);
}

const post = (body: unknown) =>
  request(app)
    .post('/api/v1/match')
    .send(body as object);

describe('bad input to POST /api/v1/match', () => {
  it('unknown unit → 400 at /body/conductivity/unit', async () => {
    expectProblem(
      await post({ conductivity: { value: 28, unit: 'furlong' } }),
      400,
      '/body/conductivity/unit',
    );
  });
  it('zero conductivity → 400 at /body/conductivity/value', async () => {
    expectProblem(
      await post({ conductivity: { value: 0, unit: '%IACS' } }),
      400,
      '/body/conductivity/value',
    );
  });
  it('negative conductivity → 400', async () => {
    expectProblem(
      await post({ conductivity: { value: -28, unit: 'MS/m' } }),
      400,
      '/body/conductivity/value',
    );
  });
  it('NaN as a string → 400', async () => {
    expectProblem(
      await post({ conductivity: { value: 'NaN', unit: '%IACS' } }),
      400,
      '/body/conductivity/value',
    );
  });
  it('NaN as a bare token is malformed JSON → 400', async () => {
    const res = await request(app)
      .post('/api/v1/match')
      .set('Content-Type', 'application/json')
      .send('{"conductivity":{"value":NaN,"unit":"%IACS"}}');
    expectProblem(res, 400, '/body');
  });
  it('malformed JSON → 400 saying so', async () => {
    const res = await request(app)
      .post('/api/v1/match')
      .set('Content-Type', 'application/json')
      .send('{"conductivity":');
    expectProblem(res, 400, '/body');
    expect(res.body.detail).toMatch(/not valid JSON/);
  });
  it('missing conductivity → 400 naming it', async () => {
    const res = await post({ density: { value: 8.53, unit: 'g/cm3' } });
    expectProblem(res, 400);
    expect(res.body.detail).toMatch(/conductivity/);
  });
  it('no body at all → 400', async () => {
    const res = await request(app).post('/api/v1/match');
    expect(res.status).toBeGreaterThanOrEqual(400);
    expect(res.status).toBeLessThan(500);
    expect(res.type).toBe('application/problem+json');
  });
  it('a field the API does not know (mass assignment) → 400', async () => {
    expectProblem(await post({ conductivity: { value: 28, unit: '%IACS' }, score: 1 }), 400);
  });
  it('temperature below absolute zero in kelvin → 400 at /body/temperature/value', async () => {
    const res = await post({
      conductivity: { value: 28, unit: '%IACS' },
      temperature: { value: -5, unit: 'K' },
    });
    expectProblem(res, 400, '/body/temperature/value');
  });
  it('uncertainty above 50 % → 400', async () => {
    expectProblem(
      await post({ conductivity: { value: 28, unit: '%IACS' }, uncertaintyPercent: 500 }),
      400,
      '/body/uncertaintyPercent',
    );
  });
  it('an oversized body → 413 problem', async () => {
    const res = await post({
      conductivity: { value: 28, unit: '%IACS' },
      padding: 'x'.repeat(200_000),
    });
    expectProblem(res, 413);
  });
  it('text/plain body → 4xx problem, not a 500', async () => {
    const res = await request(app)
      .post('/api/v1/match')
      .set('Content-Type', 'text/plain')
      .send('28 %IACS');
    expect(res.status).toBeGreaterThanOrEqual(400);
    expect(res.status).toBeLessThan(500);
    expect(res.type).toBe('application/problem+json');
  });
});

describe('bad input elsewhere', () => {
  it('a huge page size → 400', async () => {
    expectProblem(await request(app).get('/api/v1/alloys?limit=99999999'), 400, '/query/limit');
  });
  it('unknown slug → 404', async () => {
    expectProblem(await request(app).get('/api/v1/alloys/no-such-alloy'), 404);
  });
  it('unknown API path → 404 problem', async () => {
    expectProblem(await request(app).get('/api/v1/no-such-thing'), 404);
    expectProblem(await request(app).get('/api/v2/alloys'), 404);
  });
  it('wrong method → 405 problem', async () => {
    expectProblem(await request(app).delete('/api/v1/alloys'), 405);
  });
});
