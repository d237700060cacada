import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Express } from 'express';
import type { Knex } from 'knex';
import { createTestApp } from '../helpers/test-app';

let app: Express;
let knex: Knex;
beforeAll(async () => ({ app, knex } = await createTestApp()));
afterAll(() => knex.destroy());

interface Item {
  slug: string;
  name: string;
  uns: string | null;
  family: string;
}

/** GET /api/v1/alloys with the query string exactly as written (no re-encoding by the client). */
async function search(rawQuery: string, extra = '&limit=100') {
  const res = await request(app).get(`/api/v1/alloys?q=${rawQuery}${extra}`);
  return res;
}

const slugs = (res: request.Response) => (res.body.items as Item[]).map((i) => i.slug);

describe('GET /api/v1/alloys?q=: how the query is spelled', () => {
  it.each([
    ['+ for the space (URLSearchParams, HTML forms)', 'cartridge+brass'],
    ['%20 for the space (encodeURIComponent)', 'cartridge%20brass'],
    ['mixed case, surrounding spaces', '%20Cartridge+BRASS%20'],
  ])('%s → 200, cartridge brass first', async (_how, q) => {
    const res = await search(q);
    expect(res.status).toBe(200);
    expect(res.type).toBe('application/json');
    expect(res.body.items[0].slug).toBe('cartridge-brass-c26000');
  });

  it('any properly encoded reserved character is accepted: 70/30, 70%2F30, a literal %2B', async () => {
    const raw = await search('70/30+brass');
    const encoded = await search('70%2F30%20brass');
    const plus = await search('C%2B%2B');
    expect(raw.status).toBe(200);
    expect(encoded.status).toBe(200);
    expect(plus.status).toBe(200);
    // "70/30 brass" is an alias of C26000 (seeds/reference/alloys.ts; common practice, no source).
    expect(raw.body.items[0].slug).toBe('cartridge-brass-c26000');
    expect(slugs(encoded)).toEqual(slugs(raw));
  });

  it('a q longer than 100 characters → 400 problem naming /query/q', async () => {
    const res = await search('a'.repeat(101));
    expect(res.status).toBe(400);
    expect(res.type).toBe('application/problem+json');
    expect(res.body.errors.map((e: { path: string }) => e.path)).toContain('/query/q');
  });
});

/**
 * Queries → the first result a practitioner expects. Sources: UNS numbers, names and compositions
 * are those of seeds/reference/alloys.ts (ASM Handbook Vol. 2, CRC); trade aliases and family words
 * ("brass" covers Muntz metal and gilding metal; "German silver" is nickel silver) are common
 * practice, no source.
 */
describe('GET /api/v1/alloys?q=: ranking', () => {
  it.each([
    // [query as sent, expected first slug, where the expectation comes from]
    ['cartridge+brass', 'cartridge-brass-c26000', 'its name'],
    ['cartridge%20brass', 'cartridge-brass-c26000', 'its name'],
    ['c26000', 'cartridge-brass-c26000', 'UNS C26000, any case'],
    ['C26000', 'cartridge-brass-c26000', 'UNS C26000'],
    ['UNS+C26000', 'cartridge-brass-c26000', 'UNS C26000 with its prefix word'],
    ['cartridge-brass-c26000', 'cartridge-brass-c26000', 'its slug'],
    [
      'Ni',
      'nickel-electrolytic',
      'symbol of nickel; electrolytic nickel is 99.9 % Ni, the richest',
    ],
    ['cupronickel', 'cupronickel-90-10-c70600', 'its name; the first of the three in table order'],
    ['nickel+silver', 'nickel-silver-c75200', 'its name'],
    ['German+silver', 'nickel-silver-c75200', 'alias: common practice, no source'],
    ['stainless', 'stainless-304', 'its name; the first of five in table order'],
    ['catridge', 'cartridge-brass-c26000', 'a typo: fuzzy fallback'],
    ['cartrige', 'cartridge-brass-c26000', 'another typo'],
    ['Muntz', 'muntz-metal-c28000', 'its name'],
    ['18-8', 'stainless-304', 'alias: common practice, no source'],
    ['OFHC', 'copper-c10200', 'alias: common practice, no source'],
    ['electrolytic+tough+pitch', 'copper-c11000', 'its name, hyphen or not'],
    ['70%2F30+brass', 'cartridge-brass-c26000', 'alias: common practice, no source'],
    ['yellow+metal', 'muntz-metal-c28000', 'alias: common practice, no source'],
    ['Sn', 'tin', 'symbol of tin'],
    ['zinc', 'zinc-shg', 'its name, then the zinc alloys'],
  ])('q=%s → %s first (%s)', async (q, first) => {
    const res = await search(q);
    expect(res.status).toBe(200);
    expect(res.body.items[0]?.slug).toBe(first);
  });

  it('an exact UNS number returns that alloy alone, not a dozen fuzzy neighbours', async () => {
    for (const q of ['C26000', 'c26000']) {
      const res = await search(q);
      expect(res.body.total).toBe(1);
      expect(slugs(res)).toEqual(['cartridge-brass-c26000']);
    }
  });

  it('"Ni" matches the symbol, not the letters inside "Aluminium": no aluminium alloy in the top ten', async () => {
    const res = await search('Ni');
    const top = (res.body.items as Item[]).slice(0, 10);
    expect(top.some((i) => i.family === 'aluminium')).toBe(false);
    // Nickel alloys and cupronickels ahead of the stainless steels (8–12 % Ni, ASM Vol. 1).
    const at = (slug: string) => slugs(res).indexOf(slug);
    expect(at('nickel-copper-400')).toBeLessThan(at('stainless-304'));
    expect(at('cupronickel-70-30-c71500')).toBeLessThan(at('stainless-304'));
    expect((res.body.items as Item[]).every((i) => i.family !== 'aluminium')).toBe(true);
  });

  it('"brass" includes Muntz metal and gilding metal, named brasses first', async () => {
    const res = await search('brass');
    const list = slugs(res);
    // Muntz metal (60/40) and gilding metal (95/5) are brasses (copper-zinc): common practice, no source.
    expect(list).toContain('muntz-metal-c28000');
    expect(list).toContain('gilding-metal-c21000');
    expect(list).toContain('cartridge-brass-c26000');
    expect(res.body.items[0].name.toLowerCase()).toContain('brass');
    expect((res.body.items as Item[]).every((i) => i.family === 'copper-zinc')).toBe(true);
  });

  it('"nickel silver" and "German silver" list the two nickel silvers and nothing with only one word', async () => {
    for (const q of ['nickel+silver', 'German%20silver']) {
      const res = await search(q);
      expect(slugs(res)).toEqual(['nickel-silver-c75200', 'nickel-silver-c77000']);
    }
  });

  it('"cupronickel" lists the three cupronickels (C70600, C71300, C71500) first', async () => {
    const res = await search('cupronickel');
    expect(slugs(res).slice(0, 3).sort()).toEqual([
      'cupronickel-70-30-c71500',
      'cupronickel-75-25-c71300',
      'cupronickel-90-10-c70600',
    ]);
  });

  it('"stainless" lists the stainless steels and nothing else', async () => {
    const res = await search('stainless');
    expect(slugs(res)).toEqual([
      'stainless-304',
      'stainless-316',
      'stainless-430',
      'stainless-410',
      'stainless-17-4ph',
    ]);
  });

  it('a typo keeps only the close fuzzy hits', async () => {
    const res = await search('catridge');
    expect(res.body.items[0].slug).toBe('cartridge-brass-c26000');
    expect(res.body.total).toBeLessThanOrEqual(3);
  });

  it('while typing, the start of a word already finds it ("cartr", "nickel sil")', async () => {
    expect((await search('cartr')).body.items[0].slug).toBe('cartridge-brass-c26000');
    expect((await search('nickel+sil')).body.items[0].slug).toBe('nickel-silver-c75200');
  });

  it('filters still apply to a search, and sort overrides relevance', async () => {
    const res = await search('brass', '&sort=-conductivity&limit=100');
    const sigma = (res.body.items as Array<{ conductivitySPerM: number }>).map(
      (i) => i.conductivitySPerM,
    );
    expect(sigma).toEqual([...sigma].sort((a, b) => b - a));
    const magnetic = await search('Ni', '&magnetic=true&limit=100');
    expect(slugs(magnetic).slice(0, 2)).toEqual(['nickel-electrolytic', 'nickel-200']);
  });
});

describe('GET /api/v1/alloys/{slug}: aliases', () => {
  it('returns the alloy with its trade aliases', async () => {
    const res = await request(app).get('/api/v1/alloys/muntz-metal-c28000');
    expect(res.status).toBe(200);
    // common practice, no source
    expect(res.body.aliases).toEqual(expect.arrayContaining(['60/40 brass']));
    const none = await request(app).get('/api/v1/alloys/lead');
    expect(none.body.aliases).toEqual([]);
  });
});
