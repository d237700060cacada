// Issue 9, delivery: compression for the API and the front end, a year's cache for hashed
// assets, none for index.html, and our header over the API reference.
import fs from 'node:fs';
import path from 'node:path';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { clientDist } from '../../backend/paths';
import { createTestApp, type TestApp } from '../helpers/test-app';

let t: TestApp;
beforeAll(async () => (t = await createTestApp({ serveClient: true })));
afterAll(() => t.knex.destroy());

describe('delivery', () => {
  it('compresses API answers for a client that accepts gzip or brotli', async () => {
    const gz = await request(t.app).get('/api/v1/alloys?limit=50').set('Accept-Encoding', 'gzip');
    expect(gz.status).toBe(200);
    expect(gz.headers['content-encoding']).toBe('gzip');
    const br = await request(t.app).get('/api/v1/alloys?limit=50').set('Accept-Encoding', 'br');
    expect(br.headers['content-encoding']).toBe('br');
  });

  it('hashed assets are immutable for a year; index.html is revalidated', async () => {
    // The largest script: compression skips bodies under 1 kB.
    const dir = path.join(clientDist, 'assets');
    const assets = fs
      .readdirSync(dir)
      .filter((f) => f.endsWith('.js'))
      .sort((a, b) => fs.statSync(path.join(dir, b)).size - fs.statSync(path.join(dir, a)).size);
    expect(assets.length).toBeGreaterThan(0);
    const asset = await request(t.app).get(`/assets/${assets[0]}`).set('Accept-Encoding', 'gzip');
    expect(asset.status).toBe(200);
    expect(asset.headers['cache-control']).toBe('public, max-age=31536000, immutable');
    expect(asset.headers['content-encoding']).toBe('gzip');
    for (const page of ['/', '/match', '/alloys/copper-c11000']) {
      const html = await request(t.app).get(page);
      expect(html.status).toBe(200);
      expect(html.headers['cache-control']).toBe('no-cache');
    }
    expect((await request(t.app).get('/assets/no-such-file.js')).status).toBe(404);
  });

  it('the API reference carries our header with a way back to the product', async () => {
    const page = await request(t.app).get('/api/docs/');
    expect(page.status).toBe(200);
    expect(page.text).toContain('/api/docs/header.js');
    const script = await request(t.app).get('/api/docs/header.js');
    expect(script.status).toBe(200);
    expect(script.type).toBe('text/javascript');
    expect(script.text).toContain("home.href = '/'");
  });
});
