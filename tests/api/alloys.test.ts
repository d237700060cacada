import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Express } from 'express';
import type { Knex } from 'knex';
import { createTestApp } from '../helpers/test-app';

let app: Express;
let knex: Knex;
beforeAll(async () => ({ app, knex } = await createTestApp()));
afterAll(() => knex.destroy());

const get = (url: string) => request(app).get(url);

describe('GET /api/v1/alloys', () => {
  it('valid, no query → 200, the first page sorted by name with total, limit and offset', async () => {
    const res = await get('/api/v1/alloys');
    expect(res.status).toBe(200);
    expect(res.type).toBe('application/json');
    expect(res.body.limit).toBe(25);
    expect(res.body.offset).toBe(0);
    expect(res.body.total).toBeGreaterThanOrEqual(45);
    expect(res.body.items).toHaveLength(25);
    const names = res.body.items.map((i: { name: string }) => i.name);
    expect(names).toEqual([...names].sort((a: string, b: string) => a.localeCompare(b)));
    expect(Object.keys(res.body.items[0])).toEqual(
      expect.arrayContaining([
        'slug',
        'name',
        'uns',
        'family',
        'magnetic',
        'conductivitySPerM',
        'densityKgPerM3',
      ]),
    );
  });

  it('q=brass → fuzzy matches, all brasses first', async () => {
    const res = await get('/api/v1/alloys?q=brass');
    expect(res.status).toBe(200);
    expect(res.body.items.map((i: { uns: string }) => i.uns)).toContain('C26000');
    expect(res.body.items[0].name.toLowerCase()).toContain('brass');
  });

  it('q with a typo (cartrige) still finds cartridge brass', async () => {
    const res = await get('/api/v1/alloys?q=cartrige');
    expect(res.body.items[0].uns).toBe('C26000');
  });

  it('q=C71500 finds the alloy by its UNS number', async () => {
    const res = await get('/api/v1/alloys?q=C71500');
    expect(res.body.items[0].slug).toBe('cupronickel-70-30-c71500');
  });

  it('q=zinc finds by element name, q=Sn by symbol', async () => {
    const zinc = await get('/api/v1/alloys?q=zinc&family=zinc');
    expect(zinc.body.items.length).toBeGreaterThanOrEqual(3);
    const tin = await get('/api/v1/alloys?q=Sn');
    expect(tin.body.items.map((i: { slug: string }) => i.slug)).toContain('phosphor-bronze-c51000');
  });

  it('family filters combine (repeated parameter)', async () => {
    const res = await get('/api/v1/alloys?family=zinc&family=aluminium&limit=100');
    expect(new Set(res.body.items.map((i: { family: string }) => i.family))).toEqual(
      new Set(['zinc', 'aluminium']),
    );
  });

  it('magnetic=true returns only magnetic alloys', async () => {
    const res = await get('/api/v1/alloys?magnetic=true&limit=100');
    expect(res.body.total).toBeGreaterThan(3);
    expect(res.body.items.every((i: { magnetic: boolean }) => i.magnetic)).toBe(true);
  });

  it('conductivity range in %IACS, MS/m and µΩ·cm select the same alloys', async () => {
    const iacs = await get('/api/v1/alloys?conductivityMin=25&conductivityMax=30&limit=100');
    const ms = await get(
      '/api/v1/alloys?conductivityMin=14.5&conductivityMax=17.4&conductivityUnit=MS/m&limit=100',
    );
    // 25–30 %IACS is 172.41/30 = 5.747 to 172.41/25 = 6.896 µΩ·cm: a resistivity range turns around.
    const rho = await get(
      `/api/v1/alloys?conductivityMin=5.747&conductivityMax=6.897&conductivityUnit=${encodeURIComponent('µΩ·cm')}&limit=100`,
    );
    const slugs = (r: request.Response) => r.body.items.map((i: { slug: string }) => i.slug).sort();
    expect(slugs(iacs)).toContain('cartridge-brass-c26000');
    expect(slugs(ms)).toEqual(slugs(iacs));
    expect(slugs(rho)).toEqual(slugs(iacs));
  });

  it('density range in lb/in³ works like g/cm³', async () => {
    const g = await get('/api/v1/alloys?densityMin=2.6&densityMax=2.8&limit=100');
    const lb = await get(
      '/api/v1/alloys?densityMin=0.0939&densityMax=0.1012&densityUnit=lb%2Fin3&limit=100',
    );
    // Typed by hand, unencoded, the unit is accepted too.
    const raw = await get(
      '/api/v1/alloys?densityMin=0.0939&densityMax=0.1012&densityUnit=lb/in3&limit=100',
    );
    expect(raw.body.total).toBe(lb.body.total);
    expect(g.body.total).toBe(lb.body.total);
    expect(g.body.items.every((i: { family: string }) => i.family === 'aluminium')).toBe(true);
  });

  it('sort=-conductivity puts silver first; paging with offset walks the list', async () => {
    const first = await get('/api/v1/alloys?sort=-conductivity&limit=2');
    expect(first.body.items[0].slug).toBe('silver-fine');
    const second = await get('/api/v1/alloys?sort=-conductivity&limit=2&offset=1');
    expect(second.body.items[0].slug).toBe(first.body.items[1].slug);
  });

  it('nothing matches → 200 with an empty page', async () => {
    const res = await get('/api/v1/alloys?q=unobtainium-xyz');
    expect(res.status).toBe(200);
    expect(res.body).toEqual({ items: [], total: 0, limit: 25, offset: 0 });
  });

  it.each([
    ['limit=1000000', '/query/limit'],
    ['limit=0', '/query/limit'],
    ['offset=-1', '/query/offset'],
    ['sort=colour', '/query/sort'],
    ['family=plastic', '/query/family'],
    ['conductivityMin=-3', '/query/conductivityMin'],
    ['conductivityMin=abc', '/query/conductivityMin'],
    ['conductivityUnit=furlong', '/query/conductivityUnit'],
    ['densityUnit=stone', '/query/densityUnit'],
  ])('invalid %s → 400 problem naming %s', async (query, path) => {
    const res = await get(`/api/v1/alloys?${query}`);
    expect(res.status).toBe(400);
    expect(res.type).toBe('application/problem+json');
    expect(res.body.errors.map((e: { path: string }) => e.path.replace(/\/\d+$/, ''))).toContain(
      path,
    );
  });
});

describe('GET /api/v1/alloys/{slug}', () => {
  it('valid → 200 with composition and every value with its source', async () => {
    const res = await get('/api/v1/alloys/cartridge-brass-c26000');
    expect(res.status).toBe(200);
    expect(res.body.uns).toBe('C26000');
    expect(res.body.composition).toEqual([
      { element: 'Cu', massPercent: 70 },
      { element: 'Zn', massPercent: 30 },
    ]);
    const conductivity = res.body.values.find(
      (v: { quantity: string }) => v.quantity === 'conductivity',
    );
    expect(conductivity).toMatchObject({
      nominal: 16.24e6,
      unit: 'S/m',
      referenceTemperatureK: 293.15,
      source: { kind: 'handbook' },
    });
    expect(conductivity.min).toBeLessThan(conductivity.nominal);
    expect(conductivity.source.citation).toMatch(/Copper Development Association/);
  });

  it('unknown slug → 404 problem+json', async () => {
    const res = await get('/api/v1/alloys/unobtainium');
    expect(res.status).toBe(404);
    expect(res.type).toBe('application/problem+json');
    expect(res.body).toMatchObject({
      status: 404,
      title: 'Not found',
      detail: "No alloy 'unobtainium' in the table",
    });
  });

  it('malformed slug → 400 problem naming the path parameter', async () => {
    const res = await get('/api/v1/alloys/NOT%20A%20SLUG');
    expect(res.status).toBe(400);
    expect(res.body.errors[0].path).toBe('/params/slug');
  });
});
