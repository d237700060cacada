import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Express } from 'express';
import type { Knex } from 'knex';
import { createTestApp } from '../helpers/test-app';

let app: Express;
let knex: Knex;
beforeAll(async () => ({ app, knex } = await createTestApp()));
afterAll(() => knex.destroy());

describe('GET /api/v1/health', () => {
  it('valid → 200 with the status, the version and the size of the table', async () => {
    const res = await request(app).get('/api/v1/health');
    expect(res.status).toBe(200);
    expect(res.type).toBe('application/json');
    expect(res.body).toEqual({
      status: 'ok',
      version: expect.any(String),
      database: process.env.DATABASE_URL?.startsWith('postgres') ? 'postgres' : 'sqlite',
      alloys: expect.any(Number),
    });
    expect(res.body.alloys).toBeGreaterThanOrEqual(45);
  });

  it('sends the security headers and no x-powered-by', async () => {
    const res = await request(app).get('/api/v1/health');
    expect(res.headers['x-powered-by']).toBeUndefined();
    expect(res.headers['x-content-type-options']).toBe('nosniff');
    expect(res.headers['content-security-policy']).toContain("default-src 'self'");
  });

  it('database gone → 503 problem, so a proxy takes the instance out of rotation', async () => {
    const gone = await createTestApp();
    await gone.knex.destroy();
    const res = await request(gone.app).get('/api/v1/health');
    expect(res.status).toBe(503);
    expect(res.type).toBe('application/problem+json');
    expect(res.body.detail).toBe('The database does not answer.');
  });

  it('unknown query parameter → 400 problem naming it', async () => {
    const res = await request(app).get('/api/v1/health?verbose=1');
    expect(res.status).toBe(400);
    expect(res.type).toBe('application/problem+json');
    expect(res.body.errors[0].path).toMatch(/verbose/);
  });
});

describe('API reference', () => {
  it('serves Swagger UI at /api/docs/', async () => {
    const res = await request(app).get('/api/docs/');
    expect(res.status).toBe(200);
    expect(res.text).toContain('swagger-ui');
  });
  it('serves the OpenAPI document as JSON', async () => {
    const res = await request(app).get('/api/openapi.json');
    expect(res.status).toBe(200);
    expect(res.body.openapi).toBe('3.0.3');
  });
});
