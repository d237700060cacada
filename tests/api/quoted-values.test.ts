import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { alloys } from '../../seeds/reference/alloys';
import { quotedFigures } from '../../seeds/reference/quoted-figures';
import { quotedLineFor } from '../../seeds/reference/quoted-line';
import { signedIn } from '../helpers/access';
import { createTestApp, type TestApp } from '../helpers/test-app';

/**
 * The quote beside each value (property_values.quoted): what the located source prints, as the
 * seed wrote it; none on a value a curator changed.
 */
let t: TestApp;
/** A quote as the seed writes one (the figure the CDA page prints for C26000, source 2). */
const QUOTE = 'C26000: 28 %IACS at 20 °C';
const SLUG = 'cartridge-brass-c26000';

interface Value {
  quantity: string;
  quoted?: string | null;
  source: { id: number; url: string | null };
}
const valuesOf = async (slug: string) =>
  (await request(t.app).get(`/api/v1/alloys/${slug}`)).body.values as Value[];

beforeAll(async () => {
  t = await createTestApp({ accounts: true });
  // Before the first request, which loads the catalogue: a row as a located figure leaves it.
  const [{ id }] = await t
    .knex('property_values as v')
    .join('alloys as a', 'a.id', 'v.alloy_id')
    .where({ 'a.slug': SLUG, 'v.quantity': 'conductivity' })
    .select('v.id');
  await t.knex('property_values').where({ id }).update({ quoted: QUOTE });
});
afterAll(() => t.knex.destroy());

describe('GET /api/v1/alloys/{slug}: the quote beside each value', () => {
  it('carries the seed’s quote line on every value (null where no located figure backs it)', async () => {
    for (const a of alloys) {
      for (const v of await valuesOf(a.slug)) {
        const expected =
          a.slug === SLUG && v.quantity === 'conductivity'
            ? QUOTE
            : quotedLineFor(quotedFigures, a.slug, v.quantity, v.source.id);
        expect(v.quoted, `${a.slug} ${v.quantity}`).toBe(expected);
      }
    }
  });

  it('sends the quote with the source it was read from, and that source’s address', async () => {
    const c = (await valuesOf(SLUG)).find((v) => v.quantity === 'conductivity')!;
    expect(c.quoted).toBe(QUOTE);
    expect(c.source.id).toBe(2);
    expect(c.source.url).toMatch(/^https:\/\/copper\.org\//);
  });

  it('drops the quote when a reviewed change replaces the value and its source', async () => {
    const author = await signedIn(t.app, 'curator');
    const proposed = await author.post('/api/v1/revisions').send({
      kind: 'edit',
      alloy: SLUG,
      set: { values: { conductivity: { nominal: 16.0e6, min: 15.66e6, max: 16.82e6 } } },
      source: {
        citation: 'Mill test certificate, strip lot 4471 (invented for the test)',
        kind: 'measurement_set',
        locator: 'sheet 2',
      },
      reason: 'Lot measurements read 27.6 %IACS on average',
    });
    expect(proposed.status, JSON.stringify(proposed.body)).toBe(201);
    const reviewer = await signedIn(t.app, 'admin');
    const reviewed = await reviewer
      .post(`/api/v1/revisions/${proposed.body.id}/review`)
      .send({ decision: 'approve', comment: 'certificates checked' });
    expect(reviewed.status).toBe(200);
    const c = (await valuesOf(SLUG)).find((v) => v.quantity === 'conductivity')!;
    expect(c.quoted).toBeNull();
    expect(c.source.id).not.toBe(2);
  });
});
