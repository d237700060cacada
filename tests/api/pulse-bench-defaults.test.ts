import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Express } from 'express';
import type { Knex } from 'knex';
import { createTestApp } from '../helpers/test-app';

/**
 * Pulse Bench's first load, through the API as the screen sends it
 * (frontend/features/pulse-bench/lib/bench-form.ts): the bench bank, 100 turns of AWG 32 in a
 * 5–9.5 × 4 mm window, and the two 1 mark blanks of the demo scenario, equal in size (19 mm):
 * the first issue in solid 95/5 and the plated zinc one that replaced it.
 */
let app: Express;
let knex: Knex;
beforeAll(async () => ({ app, knex } = await createTestApp()));
afterAll(() => knex.destroy());

const mm = (value: number) => ({ value, unit: 'mm' });
const um = (value: number) => ({ value, unit: 'µm' });
const bench = {
  bank: {
    capacitance: { value: 50, unit: 'uF' },
    voltage: { value: 400, unit: 'V' },
    ratedVoltage: { value: 450, unit: 'V' },
    seriesResistance: { value: 100, unit: 'mohm' },
    supplyPower: { value: 20, unit: 'W' },
  },
  coil: { innerRadius: mm(5), outerRadius: mm(9.5), length: mm(4), turns: 100, awg: 32 },
  gap: mm(0.5),
  launchAngleDeg: 90,
};
const solid = {
  diameter: mm(19),
  layers: [{ material: { alloy: 'gilding-metal-c21000' }, thickness: mm(1.356) }],
};
const plated = {
  diameter: mm(19),
  layers: [
    { material: { alloy: 'copper-c11000' }, thickness: um(8) },
    { material: { alloy: 'zinc-coinage-strip' }, thickness: mm(1.34) },
    { material: { alloy: 'copper-c11000' }, thickness: um(8) },
  ],
};
const launch = async (blank: object, extra: object = {}) => {
  const res = await request(app)
    .post('/api/v1/estimates/launch')
    .send({ ...bench, ...extra, blank });
  expect(res.status, JSON.stringify(res.body)).toBe(200);
  return res.body;
};

describe('Pulse Bench defaults: the trade rules of thumb on first load', () => {
  it('the demo scenario holds both 1 mark blanks at the same size', async () => {
    const res = await request(app).get('/api/v1/stacks');
    const bySlug = new Map(
      res.body.items.map((s: { slug: string; diameterM: number }) => [s.slug, s]),
    );
    const a = bySlug.get('estmark-1-mark') as { diameterM: number };
    const b = bySlug.get('estmark-1-mark-solid') as { diameterM: number };
    expect(a.diameterM).toBe(b.diameterM);
  });

  it('the coil can be wound: it fills about a quarter of its window', async () => {
    const r = await launch(solid);
    expect(r.coil.fillFactor).toBeGreaterThan(0.15);
    expect(r.coil.fillFactor).toBeLessThan(0.5);
    expect(r.warnings).toEqual([]);
  });

  it('peaks of order 100 A and is well under 1 % efficient (common practice, no source)', async () => {
    const r = await launch(solid);
    expect(r.peakCurrentA).toBeGreaterThan(70);
    expect(r.peakCurrentA).toBeLessThan(150);
    expect(r.efficiency).toBeLessThan(0.01);
  });

  it('throws the solid 95/5 blank several times higher than the plated zinc one of the same size', async () => {
    // Common practice, no source: "four to five times". This model gives about 3 with this bank
    // (3.6 with 100 µF): the ratio grows as the pulse lengthens against the blanks' own L/R time,
    // from (m_plated/m_solid)² ≈ 0.7 for a pulse much shorter than it towards (σ/ρ)⁴ scaling,
    // about 9, for one much longer (our reasoning from the two limits of the induced current).
    const a = await launch(solid);
    const b = await launch(plated);
    const ratio = a.heightM / b.heightM;
    expect(ratio).toBeGreaterThan(2.5);
    expect(ratio).toBeLessThan(6);
  });

  it('says how long the charger takes: ½CV² over its power', async () => {
    const r = await launch(solid);
    expect(r.energy.storedJ).toBeCloseTo(4, 9); // ½ · 50 µF · (400 V)²
    expect(r.chargeTimeS).toBeCloseTo(0.2, 9); // 4 J / 20 W
  });

  it('the portable bank charged above its rating warns, and its inverter takes seconds', async () => {
    const r = await launch(solid, {
      bank: {
        capacitance: { value: 47, unit: 'uF' },
        voltage: { value: 400, unit: 'V' },
        ratedVoltage: { value: 350, unit: 'V' },
        seriesResistance: { value: 200, unit: 'mohm' },
        supplyPower: { value: 2, unit: 'W' },
      },
    });
    expect(r.warnings.map((w: { code: string }) => w.code)).toContain('bank-over-rated-voltage');
    expect(r.chargeTimeS).toBeCloseTo((0.5 * 47e-6 * 400 ** 2) / 2, 9);
  });

  it('a supply power of zero or in an unknown unit is refused, naming the field', async () => {
    for (const supplyPower of [
      { value: 0, unit: 'W' },
      { value: 5, unit: 'hp' },
    ]) {
      const res = await request(app)
        .post('/api/v1/estimates/launch')
        .send({ ...bench, bank: { ...bench.bank, supplyPower }, blank: solid });
      expect(res.status).toBe(400);
      expect(res.type).toBe('application/problem+json');
      expect(JSON.stringify(res.body.errors)).toContain('/body/bank/supplyPower');
    }
  });

  describe('with a laminated-steel core in the bore (issue 10)', () => {
    const core = {
      radius: mm(4.5),
      length: mm(20),
      relativePermeability: 1000,
      saturationFluxDensity: { value: 1500, unit: 'mT' },
    };
    const cored = { ...bench, coil: { ...bench.coil, core } };

    it('throws the same blank several times higher, reports the core flux density and warns of saturation', async () => {
      // Figures of tests/unit/physics/launch-cored.test.ts: air 76 mm, cored about 348 mm, with
      // some 3.2 T in a core that saturates at 1.5 T: the linear model overstates the cored throw.
      const air = await launch(solid);
      const res = await request(app)
        .post('/api/v1/estimates/launch')
        .send({ ...cored, blank: solid });
      expect(res.status, JSON.stringify(res.body)).toBe(200);
      expect(res.body.heightM / air.heightM).toBeGreaterThan(3);
      expect(res.body.coil.inductanceH / air.coil.inductanceH).toBeGreaterThan(1.5);
      expect(res.body.core.peakFluxDensityT).toBeGreaterThan(1.5);
      expect(res.body.warnings.map((w: { code: string }) => w.code)).toContain('core-saturation');
      expect(air.core).toBeUndefined();
    });

    it('below saturation (at 100 V) it does not warn', async () => {
      const res = await request(app)
        .post('/api/v1/estimates/launch')
        .send({
          ...cored,
          bank: { ...bench.bank, voltage: { value: 100, unit: 'V' } },
          blank: solid,
        });
      expect(res.status).toBe(200);
      expect(res.body.core.peakFluxDensityT).toBeLessThan(1.5);
      expect(res.body.warnings.map((w: { code: string }) => w.code)).not.toContain(
        'core-saturation',
      );
    });

    it('a core wider than the bore → 422 naming /body/coil/core', async () => {
      const res = await request(app)
        .post('/api/v1/estimates/launch')
        .send({
          ...bench,
          coil: { ...bench.coil, core: { ...core, radius: mm(6) } },
          blank: solid,
        });
      expect(res.status).toBe(422);
      expect(res.type).toBe('application/problem+json');
      expect(JSON.stringify(res.body.errors)).toContain('/body/coil/core');
    });

    it('a permeability below 1 or a flux density in an unknown unit → 400', async () => {
      for (const bad of [
        { ...core, relativePermeability: 0.5 },
        { ...core, saturationFluxDensity: { value: 1.5, unit: 'gauss' } },
        { ...core, extra: 1 },
      ]) {
        const res = await request(app)
          .post('/api/v1/estimates/launch')
          .send({ ...bench, coil: { ...bench.coil, core: bad }, blank: solid });
        expect(res.status, JSON.stringify(bad)).toBe(400);
        expect(res.type).toBe('application/problem+json');
      }
    });
  });
});
