import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Express } from 'express';
import type { Knex } from 'knex';
import { createTestApp } from '../helpers/test-app';

let app: Express;
let knex: Knex;
beforeAll(async () => ({ app, knex } = await createTestApp()));
afterAll(() => knex.destroy());

describe('GET /api/v1/readings', () => {
  it('valid → 200 with the demo scenario readings, each marked invented', async () => {
    const res = await request(app).get('/api/v1/readings');
    expect(res.status).toBe(200);
    expect(res.body.items.length).toBeGreaterThanOrEqual(6);
    for (const r of res.body.items) {
      expect(r.invented).toBe(true);
      expect(r.site).toMatch(/Ridgeline Metals Recovery/);
    }
  });
});
