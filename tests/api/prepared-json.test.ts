// Issue 13: a production server sends a cached search page's bytes; development and the tests send
// the same page through res.json, where the validator checks it. Both ways must give the same answer.
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp, type TestApp } from '../helpers/test-app';

let checked: TestApp;
let sent: TestApp;
beforeAll(async () => {
  checked = await createTestApp({ validateResponses: true });
  sent = await createTestApp({ validateResponses: false });
});
afterAll(async () => {
  await checked.knex.destroy();
  await sent.knex.destroy();
});

const queries = [
  '/api/v1/alloys?q=brass',
  '/api/v1/alloys?q=Phosphor%20Bronze&limit=5',
  '/api/v1/alloys?family=aluminium&sort=-conductivity',
  '/api/v1/alloys?conductivityMin=20&conductivityMax=30&conductivityUnit=MS/m&offset=2',
];

describe('a search answer sent from its cached bytes', () => {
  it.each(queries)(
    '%s: the same bytes, type and ETag as res.json, first and second time',
    async (path) => {
      const viaJson = await request(checked.app).get(path);
      expect(viaJson.status).toBe(200);
      for (let i = 0; i < 2; i++) {
        const viaBytes = await request(sent.app).get(path);
        expect(viaBytes.status).toBe(200);
        expect(viaBytes.text).toBe(viaJson.text);
        expect(viaBytes.headers['content-type']).toBe(viaJson.headers['content-type']);
        expect(viaBytes.headers.etag).toBe(viaJson.headers.etag);
      }
    },
  );

  it('answers 304 to If-None-Match with the ETag, both ways', async () => {
    for (const app of [checked.app, sent.app]) {
      const first = await request(app).get(queries[0]!);
      const again = await request(app).get(queries[0]!).set('If-None-Match', first.headers.etag!);
      expect(again.status).toBe(304);
      expect(again.text).toBe('');
    }
  });
});

describe('a Match answer sent without res.send', () => {
  const readings = [
    { conductivity: { value: 28, unit: '%IACS' }, density: { value: 8.53, unit: 'g/cm3' } },
    {
      conductivity: { value: 58, unit: 'MS/m' },
      temperature: { value: 60, unit: 'C' },
      limit: 3,
    },
  ];
  it.each(readings)(
    'the same bytes and type as res.json, and no ETag on a POST (%#)',
    async (body) => {
      // identity: the length is compared as sent, before compression takes it off.
      const viaJson = await request(checked.app)
        .post('/api/v1/match')
        .set('Accept-Encoding', 'identity')
        .send(body);
      const viaBytes = await request(sent.app)
        .post('/api/v1/match')
        .set('Accept-Encoding', 'identity')
        .send(body);
      expect(viaJson.status).toBe(200);
      expect(viaBytes.status).toBe(200);
      expect(viaBytes.text).toBe(viaJson.text);
      expect(viaBytes.headers['content-type']).toBe(viaJson.headers['content-type']);
      expect(viaBytes.headers['content-length']).toBe(String(Buffer.byteLength(viaJson.text)));
      expect(viaBytes.headers.etag).toBeUndefined();
    },
  );

  it('is compressed when the client asks, like any other answer', async () => {
    const res = await request(sent.app)
      .post('/api/v1/match')
      .set('Accept-Encoding', 'gzip')
      .send(readings[0]);
    expect(res.status).toBe(200);
    expect(res.headers['content-encoding']).toBe('gzip');
    expect((res.body as { candidates: unknown[] }).candidates.length).toBeGreaterThan(0);
  });
});
