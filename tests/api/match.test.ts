import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Express } from 'express';
import type { Knex } from 'knex';
import { createTestApp } from '../helpers/test-app';

let app: Express;
let knex: Knex;
beforeAll(async () => ({ app, knex } = await createTestApp()));
afterAll(() => knex.destroy());

const match = (body: unknown) =>
  request(app)
    .post('/api/v1/match')
    .send(body as object);

describe('POST /api/v1/match', () => {
  it('cartridge-brass reading (28 %IACS, 8.53 g/cm³; CDA and mill data) → C26000 in the first three', async () => {
    const res = await match({
      conductivity: { value: 28, unit: '%IACS' },
      density: { value: 8.53, unit: 'g/cm3' },
    });
    expect(res.status).toBe(200);
    expect(res.type).toBe('application/json');
    const top3 = res.body.candidates.slice(0, 3).map((c: { uns: string }) => c.uns);
    expect(top3).toContain('C26000');
    const c26000 = res.body.candidates.find((c: { uns: string }) => c.uns === 'C26000');
    expect(c26000.score).toBeGreaterThan(0.9);
    expect(c26000.score).toBeLessThanOrEqual(1);
    expect(c26000.reasons).toContain('28.0 %IACS at 20 °C lies inside 27.0–29.0 %IACS');
    expect(c26000.reasons).toContain('density 8.53 g/cm³ matches 8.53 g/cm³');
  });

  it('the same reading as a resistivity (6.16 µΩ·cm, mill data for C26000) ranks the same alloy first', async () => {
    const res = await match({
      conductivity: { value: 6.16, unit: 'µΩ·cm' },
      density: { value: 8.53, unit: 'g/cm³' },
    });
    expect(res.status).toBe(200);
    expect(res.body.candidates[0].uns).toBe('C26000');
    expect(res.body.reading.conductivitySPerM).toBeCloseTo(1 / 6.16e-8, 0);
  });

  it('a warm reading is corrected to 20 °C and the reasons say so', async () => {
    const res = await match({
      conductivity: { value: 27.4, unit: '%IACS' },
      temperature: { value: 40, unit: 'C' },
    });
    const c26000 = res.body.candidates.find((c: { uns: string }) => c.uns === 'C26000');
    expect(c26000.reasons[0]).toMatch(/read at 40 °C corrects to 28\.0 %IACS at 20 °C/);
    expect(res.body.reading.temperatureK).toBeCloseTo(313.15, 6);
  });

  it('marks magnetic candidates', async () => {
    const res = await match({
      conductivity: { value: 12.1, unit: '%IACS' },
      density: { value: 7.87, unit: 'g/cm3' },
    });
    const steel = res.body.candidates.find((c: { slug: string }) => c.slug === 'steel-1008');
    expect(steel.magnetic).toBe(true);
    expect(steel.reasons.at(-1)).toMatch(/^magnetic/);
  });

  it('limit caps the candidates', async () => {
    const res = await match({
      conductivity: { value: 28, unit: '%IACS' },
      uncertaintyPercent: 20,
      limit: 2,
    });
    expect(res.body.candidates).toHaveLength(2);
  });

  it('a reading no metal gives → 200 with no candidates', async () => {
    const res = await match({ conductivity: { value: 900, unit: '%IACS' } });
    expect(res.status).toBe(200);
    expect(res.body.candidates).toEqual([]);
  });
});
