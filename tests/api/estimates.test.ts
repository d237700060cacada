import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Express } from 'express';
import type { Knex } from 'knex';
import { createTestApp } from '../helpers/test-app';
import { typicalLaunch } from '../helpers/launches';

let app: Express;
let knex: Knex;
beforeAll(async () => ({ app, knex } = await createTestApp()));
afterAll(() => knex.destroy());

const post = (path: string, body: unknown) =>
  request(app)
    .post(`/api/v1/estimates/${path}`)
    .send(body as object);
const mm = (value: number) => ({ value, unit: 'mm' });
const um = (value: number) => ({ value, unit: 'µm' });
const SENSOR_COIL = { innerRadius: mm(2), outerRadius: mm(4), length: mm(2), turns: 100 };
const TEAM_COIL = { innerRadius: mm(6.15), outerRadius: mm(12.4), length: mm(6.15), turns: 3790 };
const copper = { alloy: 'copper-c11000' };
const zinc = { alloy: 'zinc-coinage-strip' };
const plated = [
  { material: copper, thickness: um(8) },
  { material: zinc, thickness: mm(1.34) },
  { material: copper, thickness: um(8) },
];

function expectProblem(res: request.Response, status: number, path?: string) {
  expect(res.status, JSON.stringify(res.body)).toBe(status);
  expect(res.type).toBe('application/problem+json');
  if (path) expect(res.body.errors.map((e: { path: string }) => e.path)).toContain(path);
}

describe('POST /api/v1/estimates/skin-depth', () => {
  it('valid → copper at 60 Hz is 8.53 mm (physics.md, 100 %IACS)', async () => {
    const res = await post('skin-depth', {
      material: { conductivity: { value: 100, unit: '%IACS' } },
      frequencies: [
        { value: 60, unit: 'Hz' },
        { value: 1, unit: 'MHz' },
      ],
    });
    expect(res.status).toBe(200);
    expect(res.body.points[0].skinDepthM).toBeCloseTo(8.53e-3, 5);
    expect(res.body.points[1].skinDepthM).toBeCloseTo(66.1e-6, 7);
    expect(res.body.warnings).toEqual([]);
  });
  it('a magnetic material → a magnetic-layer warning about its µr (issue 10)', async () => {
    const res = await post('skin-depth', {
      material: { alloy: 'steel-1008' },
      frequencies: [{ value: 10, unit: 'kHz' }],
    });
    expect(res.status).toBe(200);
    expect(res.body.warnings.map((w: { code: string }) => w.code)).toEqual(['magnetic-layer']);
  });
  it('an alloy of the table by slug works; an unknown one → 400 naming it', async () => {
    const ok = await post('skin-depth', {
      material: copper,
      frequencies: [{ value: 10, unit: 'kHz' }],
    });
    expect(ok.body.points[0].skinDepthM).toBeGreaterThan(0.6e-3);
    expectProblem(
      await post('skin-depth', {
        material: { alloy: 'unobtainium' },
        frequencies: [{ value: 10, unit: 'kHz' }],
      }),
      400,
      '/body/material/alloy',
    );
  });
});

describe('POST /api/v1/estimates/impedance', () => {
  it('TEAM 15-1 (physics.md): L0 225.9 mH, L 178.63 mH, ΔR 120.67 Ω within 0.1 %', async () => {
    const res = await post('impedance', {
      coil: TEAM_COIL,
      liftOff: mm(0.88),
      layers: [{ material: { conductivity: { value: 30.6, unit: 'MS/m' } }, thickness: mm(12.22) }],
      frequencies: [{ value: 900, unit: 'Hz' }],
    });
    expect(res.status).toBe(200);
    expect(res.body.warnings).toEqual([]);
    const [p] = res.body.points;
    expect(p.coilInAir.inductanceH / 225.9e-3).toBeCloseTo(1, 2);
    expect(p.overConductor.inductanceH / 178.63e-3).toBeCloseTo(1, 2);
    expect(p.deltaZ.resistanceOhm / 120.67).toBeCloseTo(1, 2);
    expect(p.normalized.reactance).toBeCloseTo(
      p.overConductor.inductanceH / p.coilInAir.inductanceH,
      10,
    );
  });
  it('accepts a half-space as the last layer and refuses one above another layer', async () => {
    const ok = await post('impedance', {
      coil: SENSOR_COIL,
      liftOff: mm(0.5),
      layers: [{ material: zinc, halfSpace: true }],
      frequencies: [{ value: 60, unit: 'kHz' }],
    });
    expect(ok.status).toBe(200);
    const bad = await post('impedance', {
      coil: SENSOR_COIL,
      liftOff: mm(0.5),
      layers: [
        { material: zinc, halfSpace: true },
        { material: copper, thickness: um(8) },
      ],
      frequencies: [{ value: 60, unit: 'kHz' }],
    });
    expectProblem(bad, 400, '/body/layers/0/halfSpace');
  });
});

describe('POST /api/v1/estimates/apparent-conductivity', () => {
  it('a copper-plated zinc blank reads near its weighted mean at low frequency and climbs toward copper', async () => {
    const res = await post('apparent-conductivity', {
      coil: SENSOR_COIL,
      liftOff: mm(0.5),
      layers: plated,
      frequencies: [
        { value: 100, unit: 'Hz' },
        { value: 60, unit: 'kHz' },
        { value: 5, unit: 'MHz' },
      ],
    });
    expect(res.status).toBe(200);
    const [low, mid, high] = res.body.points;
    expect(low.apparentConductivitySPerM / res.body.limits.thicknessWeightedMeanSPerM).toBeCloseTo(
      1,
      1,
    );
    expect(mid.apparentPercentIacs).toBeGreaterThan(low.apparentPercentIacs);
    expect(high.apparentPercentIacs).toBeGreaterThan(mid.apparentPercentIacs);
    expect(res.body.limits.surfaceLayerSPerM).toBeCloseTo(101 * 0.58e6, 0);
    expect(res.body.warnings).toEqual([]);
  });
  it('a thin copper plating reads above its own bulk conductivity near δ ≈ its thickness (documented overshoot, issue 10)', async () => {
    // 50 µm of copper (101 %IACS, the table's C11000) on zinc: δ at 2 MHz is 46 µm (physics.md's
    // formula), 0.93 × the plating. Layered stack's curve crosses the homogeneous one at a higher σ.
    const res = await post('apparent-conductivity', {
      coil: SENSOR_COIL,
      liftOff: mm(0.5),
      layers: [
        { material: copper, thickness: um(50) },
        { material: zinc, thickness: mm(1.34) },
      ],
      frequencies: [
        { value: 2, unit: 'MHz' },
        { value: 50, unit: 'MHz' },
      ],
    });
    expect(res.status).toBe(200);
    const [near, far] = res.body.points;
    expect(near.apparentPercentIacs).toBeGreaterThan(105);
    // Far above, where δ ≪ the plating, it comes back to the face layer's value.
    expect(far.apparentPercentIacs).toBeCloseTo(101, 0);
  });
  it('bare low-carbon steel → a magnetic-layer warning saying how far the fit misses (issue 10)', async () => {
    const res = await post('apparent-conductivity', {
      coil: SENSOR_COIL,
      liftOff: mm(0.5),
      layers: [{ material: { alloy: 'steel-1008' }, thickness: mm(1.5) }],
      frequencies: [
        { value: 10, unit: 'kHz' },
        { value: 100, unit: 'kHz' },
      ],
    });
    expect(res.status).toBe(200);
    const worst = Math.max(...res.body.points.map((p: { fitResidual: number }) => p.fitResidual));
    expect(res.body.warnings).toHaveLength(1);
    expect(res.body.warnings[0].code).toBe('magnetic-layer');
    expect(res.body.warnings[0].message).toContain(`fitResidual ${Number(worst.toPrecision(2))}`);
  });
});

describe('POST /api/v1/estimates/launch', () => {
  const launch = typicalLaunch;
  it('valid → 4 J stored, a peak in the order of 100 A, under 1 % efficient, a balanced ledger (common practice, no source)', async () => {
    const res = await post('launch', launch);
    expect(res.status).toBe(200);
    const e = res.body.energy;
    expect(e.storedJ).toBeCloseTo(4, 10);
    expect(res.body.peakCurrentA).toBeGreaterThan(30);
    expect(res.body.peakCurrentA).toBeLessThan(300);
    expect(res.body.efficiency).toBeLessThan(0.01);
    expect(
      Math.abs(e.storedJ - e.coilLossJ - e.blankLossJ - e.kineticJ - e.residualJ) / e.storedJ,
    ).toBeLessThan(0.01);
    expect(res.body.series.length).toBeGreaterThan(10);
    expect(res.body.warnings).toEqual([]);
    expect(Math.abs(e.imbalanceJ) / e.storedJ).toBeLessThan(1e-6);
    // The apex counts the rise during the pulse: above the final-speed-only v²/2g (issue 10).
    expect(res.body.heightM).toBeGreaterThan(res.body.exitSpeedMPerS ** 2 / (2 * 9.80665));
  });
  it('at 5 kV: coil-heating and projectile-hazard warnings with their figures (issue 10)', async () => {
    const res = await post('launch', {
      ...launch,
      bank: { ...launch.bank, voltage: { value: 5, unit: 'kV' } },
    });
    expect(res.status).toBe(200);
    const codes = res.body.warnings.map((w: { code: string }) => w.code);
    expect(codes).toEqual(['coil-heating', 'projectile-hazard']);
    // Winding's share of the circuit's loss over (wire mass × 385 J/(kg·K), copper, CRC).
    const c = res.body.coil;
    const windingJ = (res.body.energy.coilLossJ * c.resistanceOhm) / res.body.circuitResistanceOhm;
    const rise = windingJ / (c.wireMassKg * 385);
    // Above 155 − 40 = 115 K: IEC 60085 thermal class 155 (F) from IEC 60034-1's 40 °C ambient.
    expect(rise).toBeGreaterThan(115);
    expect(res.body.warnings[0].message).toContain(`${Number(rise.toPrecision(3))} K`);
    expect(res.body.warnings[0].message).toMatch(/IEC 60085/);
    expect(res.body.warnings[1].message).toContain(`${Number(res.body.heightM.toPrecision(3))} m`);
  });
  it('a range for an angled launcher', async () => {
    const res = await post('launch', { ...launch, launchAngleDeg: 45 });
    expect(res.body.rangeM).toBeGreaterThan(0);
  });
  it('a material without density in a blank → 400 naming it', async () => {
    const res = await post('launch', {
      ...launch,
      blank: {
        diameter: mm(23),
        layers: [{ material: { conductivity: { value: 50, unit: '%IACS' } }, thickness: mm(1) }],
      },
    });
    expectProblem(res, 400, '/body/blank/layers/0/material/density');
  });
  it('reports the winding: DC resistance, inductance, wire mass and fill (issue 10)', async () => {
    const res = await post('launch', launch);
    const coil = res.body.coil;
    // 100 turns × 2π × 8.5 mm of AWG 26 (0.405 mm bare, ASTM B258) at 58 MS/m (IEC 60028):
    // 5.341 m / (58e6 × 1.288e-7 m²) = 0.715 Ω (arithmetic).
    expect(coil.resistanceOhm).toBeCloseTo(0.715, 3);
    expect(coil.inductanceH).toBe(res.body.coilInductanceH);
    // 5.341 m × 1.2876e-7 m² × 8890 kg/m³ (C11000, ASM Handbook Vol. 2) = 6.113 g (arithmetic).
    expect(coil.wireMassKg).toBeCloseTo(6.113e-3, 6);
    // 100 × π/4 × (0.450 mm, heavy build after NEMA MW 1000, recalled)² / 70 mm² (arithmetic).
    expect(coil.fillFactor).toBeCloseTo(0.227, 3);
  });
  it('a coil that cannot be wound → 422 naming /body/coil with the numbers (issue 10)', async () => {
    // 100 turns of AWG 14 in a 3.2 × 3.2 mm window: the review had it accepted (620 mm).
    const res = await post('launch', {
      ...launch,
      coil: { innerRadius: mm(5), outerRadius: mm(8.2), length: mm(3.2), turns: 100, awg: 14 },
    });
    expectProblem(res, 422, '/body/coil');
    // AWG 14 is 1.628 mm bare (ASTM B258), 1.707 mm over heavy build (NEMA MW 1000: 0.0671 in,
    // recalled); orthocyclic cells of √3/2·D² each: 100 × 2.52 mm² = 252 mm² (arithmetic).
    expect(res.body.detail).toMatch(
      /100 turns of AWG 14 \(1\.71 mm over heavy-build insulation\) need 252 mm² of window even wound orthocyclically; this coil has 10\.2 mm²/,
    );
  });
  it('a coil wound just within the orthocyclic ideal is accepted; with no wire given, it fills in square packing', async () => {
    const res = await post('launch', {
      ...launch,
      coil: { innerRadius: mm(5), outerRadius: mm(12), length: mm(10), turns: 100 },
    });
    expect(res.status).toBe(200);
    // The wire whose overall diameter fills the window in square packing: fill π/4 (geometry).
    expect(res.body.coil.fillFactor).toBeCloseTo(Math.PI / 4, 9);
  });
  it('returns ∫i²dt; a switch within its ratings and a bank within its rated voltage → no warning (issue 10)', async () => {
    const res = await post('launch', {
      ...launch,
      bank: { ...launch.bank, ratedVoltage: { value: 450, unit: 'V' } },
      // A small 25 A thyristor of the common TO-220 kind: I_TSM of a few hundred amperes and
      // an I²t of a few hundred A²s (common practice, no source).
      switch: {
        surgeCurrentRating: { value: 300, unit: 'A' },
        i2tRating: { value: 450, unit: 'A2s' },
      },
    });
    expect(res.status).toBe(200);
    const r = res.body;
    // The coil-side loss is ∫r1·i²dt with r1 constant, so ∫i²dt = loss / r1 (arithmetic).
    expect(r.i2tA2s).toBeCloseTo(r.energy.coilLossJ / r.circuitResistanceOhm, 9);
    // A pulse of ~200 A over tens of µs lets through far less than a 10 ms half-sine of the same
    // peak, I²·0.005 A²s (physics.md, arithmetic).
    expect(r.i2tA2s).toBeLessThan(r.peakCurrentA ** 2 * 0.005);
    expect(r.warnings).toEqual([]);
  });
  it('a switch over its surge and I²t ratings and a bank over its rated voltage → warnings with the figures (issue 10)', async () => {
    const res = await post('launch', {
      ...launch,
      bank: { ...launch.bank, ratedVoltage: { value: 350, unit: 'V' } },
      switch: {
        surgeCurrentRating: { value: 0.1, unit: 'kA' },
        i2tRating: { value: 1, unit: 'A²s' },
      },
    });
    expect(res.status).toBe(200);
    const byCode = Object.fromEntries(
      res.body.warnings.map((w: { code: string; message: string }) => [w.code, w.message]),
    );
    expect(Object.keys(byCode)).toEqual(['bank-over-rated-voltage', 'switch-over-rating']);
    expect(byCode['bank-over-rated-voltage']).toContain('charged to 400 V, above its rated 350 V');
    expect(byCode['switch-over-rating']).toContain(
      `a peak of ${Number(res.body.peakCurrentA.toPrecision(3))} A against its 100 A surge rating`,
    );
    expect(byCode['switch-over-rating']).toContain(
      `∫i²dt of ${Number(res.body.i2tA2s.toPrecision(3))} A²s against its 1 A²s I²t rating`,
    );
  });
  it('a rating in an unknown unit → 400 naming it', async () => {
    expectProblem(
      await post('launch', {
        ...launch,
        switch: {
          surgeCurrentRating: { value: 100, unit: 'mA' },
          i2tRating: { value: 1, unit: 'A2s' },
        },
      }),
      400,
      '/body/switch/surgeCurrentRating/unit',
    );
  });
  it('both a wire diameter and an AWG → 400', async () => {
    expectProblem(
      await post('launch', { ...launch, coil: { ...launch.coil, wireDiameter: mm(0.4) } }),
      400,
      '/body/coil/awg',
    );
  });
});

describe('bad input to the estimators: 4xx naming the field, never a hang or a 500', () => {
  const base = {
    coil: SENSOR_COIL,
    liftOff: mm(0.5),
    layers: plated,
    frequencies: [{ value: 60, unit: 'kHz' }],
  };
  it.each([
    [
      'zero radius',
      { ...base, coil: { ...SENSOR_COIL, innerRadius: mm(0) } },
      '/body/coil/innerRadius/value',
    ],
    [
      'negative length',
      { ...base, coil: { ...SENSOR_COIL, length: mm(-2) } },
      '/body/coil/length/value',
    ],
    [
      'outer radius below inner',
      { ...base, coil: { ...SENSOR_COIL, outerRadius: mm(1) } },
      '/body/coil/outerRadius',
    ],
    [
      'NaN thickness',
      { ...base, layers: [{ material: copper, thickness: { value: 'NaN', unit: 'mm' } }] },
      '/body/layers/0',
    ],
    [
      'zero frequency',
      { ...base, frequencies: [{ value: 0, unit: 'Hz' }] },
      '/body/frequencies/0/value',
    ],
    ['unknown unit', { ...base, liftOff: { value: 1, unit: 'furlong' } }, '/body/liftOff/unit'],
    ['no layers', { ...base, layers: [] }, '/body/layers'],
    [
      '500 layers',
      {
        ...base,
        layers: Array.from({ length: 500 }, () => ({ material: copper, thickness: um(8) })),
      },
      '/body/layers',
    ],
    [
      '1000 frequencies',
      {
        ...base,
        frequencies: Array.from({ length: 1000 }, (_, i) => ({ value: i + 1, unit: 'Hz' })),
      },
      '/body/frequencies',
    ],
    ['zero turns', { ...base, coil: { ...SENSOR_COIL, turns: 0 } }, '/body/coil/turns'],
  ])('%s → 400', async (_name, body, path) => {
    const res = await post('apparent-conductivity', body);
    expect(res.status, JSON.stringify(res.body)).toBe(400);
    expect(res.type).toBe('application/problem+json');
    expect(res.body.errors.some((e: { path: string }) => e.path.startsWith(path))).toBe(true);
  });

  it('a million frequencies → 413 (body limit) before any work', async () => {
    const res = await post('impedance', {
      ...base,
      frequencies: Array.from({ length: 1_000_000 }, () => ({ value: 1, unit: 'Hz' })),
    });
    expect(res.status).toBe(413);
    expect(res.type).toBe('application/problem+json');
  });

  it('too many filaments → 400', async () => {
    const res = await post('launch', {
      bank: {
        capacitance: { value: 50, unit: 'uF' },
        voltage: { value: 400, unit: 'V' },
        seriesResistance: { value: 0.05, unit: 'ohm' },
      },
      coil: { innerRadius: mm(5), outerRadius: mm(12), length: mm(10), turns: 100 },
      blank: { diameter: mm(23), layers: [{ material: copper, thickness: mm(1.75) }] },
      gap: mm(0.5),
      filaments: { blankRadial: 500 },
    });
    expectProblem(res, 400, '/body/filaments/blankRadial');
  });
});

describe('GET /api/v1/stacks', () => {
  it('lists the demo coins of Estmark (five denominations and the first-issue solid 1 mark), marked invented, with mass and mean density', async () => {
    const res = await request(app).get('/api/v1/stacks');
    expect(res.status).toBe(200);
    expect(res.body.items.map((s: { slug: string }) => s.slug)).toEqual([
      'estmark-1-mark',
      'estmark-2-marks',
      'estmark-5-marks',
      'estmark-10-marks',
      'estmark-20-marks',
      'estmark-1-mark-solid',
    ]);
    for (const s of res.body.items) {
      expect(s.invented).toBe(true);
      expect(s.massKg).toBeGreaterThan(1e-3);
      expect(s.massKg).toBeLessThan(20e-3);
    }
    const fiveMarks = res.body.items[2];
    expect(fiveMarks.densityKgPerM3).toBeCloseTo(8860, 0);
  });
});
