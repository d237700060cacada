import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createEstimatePool, type EstimatePool } from '../../backend/estimates/pool';
import { signedIn } from '../helpers/access';
import { createTestApp, TEST_PUBLIC_URL, type TestApp } from '../helpers/test-app';

/**
 * Issue 8, item 5 ("Zero 5xx from any input"): each request below once answered 500, or a 200
 * that broke its own schema or the conservation of energy. Each is sent exactly as it was found.
 */
let t: TestApp;
let pool: EstimatePool;
let admin: Awaited<ReturnType<typeof signedIn>>;

beforeAll(async () => {
  pool = createEstimatePool({ computeLimitMs: 1000, threads: 1 });
  t = await createTestApp({
    accounts: true,
    estimatePool: pool,
    estimateLimits: { visitor: 1000, reader: 1000, integrator: 1000, curator: 1000, admin: 1000 },
  });
  admin = await signedIn(t.app, 'admin');
});
afterAll(async () => {
  await pool.close();
  await t.knex.destroy();
});

const q = (value: number, unit: string) => ({ value, unit });
const SENSOR_COIL = {
  innerRadius: q(1, 'mm'),
  outerRadius: q(2, 'mm'),
  length: q(1, 'mm'),
  turns: 10,
};
const COPPER_BLANK = {
  diameter: q(20, 'mm'),
  layers: [{ material: { alloy: 'copper-c11000' }, thickness: q(1, 'mm') }],
};
const post = (path: string, body: unknown) =>
  request(t.app)
    .post(`/api/v1${path}`)
    .send(body as object);
/** A raw JSON text: 1e999 cannot come out of JSON.stringify. */
const postRaw = (path: string, text: string) =>
  request(t.app).post(`/api/v1${path}`).set('Content-Type', 'application/json').send(text);

function expectProblem(res: request.Response, status: number, path: string) {
  expect(res.status, JSON.stringify(res.body)).toBe(status);
  expect(res.type).toBe('application/problem+json');
  expect(res.body.errors.map((e: { path: string }) => e.path)).toContain(path);
}

describe('issue 8 reproducers: once 5xx, now a 4xx naming the field', () => {
  it('1. POST /match at 20 K: 422 on /body/temperature naming the range of the linear correction (was 500 "outside the linear range")', async () => {
    const res = await post('/match', {
      conductivity: q(58, 'MS/m'),
      temperature: q(20, 'K'),
    });
    expectProblem(res, 422, '/body/temperature');
    expect(res.body.detail).toMatch(/223\.15 K to 473\.15 K/);
  });

  it.each([q(25, 'C'), q(-50, 'C'), q(200, '°C')])(
    '1b. POST /match at %o still corrects (the ends of the range count)',
    async (temperature) => {
      const res = await post('/match', { conductivity: q(58, 'MS/m'), temperature });
      expect(res.status, JSON.stringify(res.body)).toBe(200);
      expect(res.body.reading.temperatureK).toBeGreaterThan(223);
    },
  );

  it('2. POST /estimates/apparent-conductivity of a 1 µm plate of 1 µS/m at 1 µHz: 422 on /body/frequencies/0 (was 500: fitResidual NaN, "must be number")', async () => {
    const res = await post('/estimates/apparent-conductivity', {
      coil: SENSOR_COIL,
      liftOff: q(0, 'mm'),
      layers: [{ material: { conductivity: q(1e-6, 'S/m') }, thickness: q(1e-6, 'm') }],
      frequencies: [q(1e-6, 'Hz')],
    });
    expectProblem(res, 422, '/body/frequencies/0');
  });

  it('3. POST /estimates/launch with a tiny bank and a coil 2 µm across and 100 mm long: 422 on /body/coil (was 500 "skin depth needs a positive frequency")', async () => {
    const res = await post('/estimates/launch', {
      bank: { capacitance: q(1, 'uF'), voltage: q(1, 'V'), seriesResistance: q(0, 'ohm') },
      coil: { innerRadius: q(1, 'um'), outerRadius: q(2, 'um'), length: q(100, 'mm'), turns: 1 },
      blank: COPPER_BLANK,
      gap: q(0, 'mm'),
    });
    expectProblem(res, 422, '/body/coil');
  });

  it('3b. the fuzz found the same with a coil of 5e-324 m inner radius, 1 µm outer, 1 m long (was 500)', async () => {
    const res = await post('/estimates/launch', {
      bank: { capacitance: q(1, 'F'), voltage: q(1, 'V'), seriesResistance: q(0, 'ohm') },
      coil: { innerRadius: q(5e-324, 'm'), outerRadius: q(1, 'um'), length: q(1, 'm'), turns: 1 },
      blank: {
        diameter: q(1, 'm'),
        layers: [{ material: { alloy: 'aluminium-1100-o' }, thickness: q(1, 'm') }],
      },
      gap: q(0, 'm'),
    });
    expectProblem(res, 422, '/body/coil');
  });

  it('4. GET /usage?days=Infinity: 400 on /query/days (was 500 "Invalid time value")', async () => {
    expectProblem(await admin.get('/api/v1/usage?days=Infinity'), 400, '/query/days');
  });

  it('4b. GET /audit?limit=Infinity: 400 on /query/limit (was 200 with the whole log)', async () => {
    expectProblem(await admin.get('/api/v1/audit?limit=Infinity'), 400, '/query/limit');
  });

  it.each([
    ['/alloys?limit=Infinity', '/query/limit'],
    ['/alloys?conductivityMin=Infinity', '/query/conductivityMin'],
    ['/alloys?conductivityMax=-Infinity', '/query/conductivityMax'],
    ['/alloys?densityMin=NaN', '/query/densityMin'],
    ['/alloys?offset=1e999', '/query/offset'],
  ])('5. GET %s: 400 on %s (all but NaN were 500)', async (url, path) => {
    expectProblem(await request(t.app).get(`/api/v1${url}`), 400, path);
  });

  it.each([
    ['get', '/revisions/Infinity'],
    ['delete', '/keys/NaN'],
    ['get', '/revisions/1e999'],
  ] as const)(
    '5a. %s %s: 400 on /params/id (on PostgreSQL the id reached a query and failed: 500)',
    async (method, url) => {
      expectProblem(await admin[method](`/api/v1${url}`), 400, '/params/id');
    },
  );

  it('5a2. an id past 32 bits: 400 on /params/id, as on PostgreSQL integer columns', async () => {
    expectProblem(await admin.get('/api/v1/revisions/2147483648'), 400, '/params/id');
  });

  it('5a3. text with a NUL character: 400 naming the field (PostgreSQL cannot store it)', async () => {
    const res = await request(t.app)
      .post('/api/v1/auth/sign-in')
      .set('Origin', TEST_PUBLIC_URL)
      .send({ email: '\u0000', password: '' });
    expectProblem(res, 400, '/body/email');
  });

  it('5b. POST /match with 1e999 in the JSON (Infinity after JSON.parse): 400 on /body/conductivity/value saying "finite" (was "must be number")', async () => {
    const res = await postRaw('/match', '{"conductivity":{"value":1e999,"unit":"MS/m"}}');
    expectProblem(res, 400, '/body/conductivity/value');
    expect(res.body.errors[0].message).toMatch(/finite/);
  });

  it('5c. -1e999 deep in an estimate body: 400 on its path', async () => {
    const res = await postRaw(
      '/estimates/skin-depth',
      '{"material":{"conductivity":{"value":58,"unit":"MS/m"}},"frequencies":[{"value":60,"unit":"Hz"},{"value":-1e999,"unit":"Hz"}]}',
    );
    expectProblem(res, 400, '/body/frequencies/1/value');
  });
});

describe('issue 8: further 5xx the fuzz found (tests/api/fuzz), each now a 4xx naming the field', () => {
  it('POST /estimates/impedance with a coil 5e-324 m long: 422 on /body/coil/length (was 500: NaN from a scale that divides by h²)', async () => {
    const res = await post('/estimates/impedance', {
      coil: {
        innerRadius: q(5e-324, 'm'),
        outerRadius: q(1, 'm'),
        length: q(5e-324, 'm'),
        turns: 1,
      },
      liftOff: q(0, 'm'),
      layers: [{ material: { conductivity: q(1, 'S/m') }, halfSpace: true }],
      frequencies: [q(1, 'Hz')],
    });
    expectProblem(res, 422, '/body/coil/length');
  });

  it('POST /estimates/impedance with a resistivity of 5.6e-309 Ω·m (σ near the largest double): 422 on the conductivity (was 500)', async () => {
    const res = await post('/estimates/impedance', {
      coil: { innerRadius: q(1, 'm'), outerRadius: q(2, 'm'), length: q(1, 'm'), turns: 1 },
      liftOff: q(1, 'm'),
      layers: [
        { material: { conductivity: q(5.56268464626801e-309, 'ohm_m') }, thickness: q(1, 'm') },
      ],
      frequencies: [q(1, 'Hz')],
    });
    expectProblem(res, 422, '/body/layers/0/material/conductivity');
  });

  it('POST /estimates/impedance at 5e-324 Hz: a 200 with finite normalised values (was 500: ΔR/ωL0 = 0/0)', async () => {
    const res = await post('/estimates/impedance', {
      coil: SENSOR_COIL,
      liftOff: q(0.5, 'mm'),
      layers: [{ material: { alloy: 'copper-c11000' }, halfSpace: true }],
      frequencies: [q(5e-324, 'Hz')],
    });
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    expect(Number.isFinite(res.body.points[0].normalized.resistance)).toBe(true);
    expect(res.body.points[0].normalized.reactance).toBeCloseTo(1, 12);
  });

  it('POST /estimates/skin-depth at 5e-324 Hz: 422 (was 500: an infinite depth, null in JSON)', async () => {
    const res = await post('/estimates/skin-depth', {
      material: { conductivity: q(1, 'S/m') },
      frequencies: [q(5e-324, 'Hz')],
    });
    expectProblem(res, 422, '/body');
  });

  it('POST /estimates/apparent-conductivity at 1 Hz and 5e-324 Hz together: 422, not a 500 from an array of Infinity points', async () => {
    const res = await post('/estimates/apparent-conductivity', {
      coil: { innerRadius: q(5e-324, 'm'), outerRadius: q(1, 'm'), length: q(100, 'm'), turns: 1 },
      liftOff: q(0, 'm'),
      layers: [{ material: { conductivity: q(1, 'S/m') }, thickness: q(1, 'm') }],
      frequencies: [q(1, 'Hz'), q(5e-324, 'Hz')],
    });
    expect(res.status, JSON.stringify(res.body)).toBe(422);
    expect(res.type).toBe('application/problem+json');
  });

  it('POST /estimates/launch with a bank of 5e-324 µF (0 F in SI): 400 on /body/bank/capacitance/value (was a 422 after the whole compute budget)', async () => {
    const res = await post('/estimates/launch', {
      bank: { capacitance: q(5e-324, 'uF'), voltage: q(400, 'V'), seriesResistance: q(0, 'ohm') },
      coil: { innerRadius: q(3, 'mm'), outerRadius: q(12, 'mm'), length: q(4, 'mm'), turns: 20 },
      blank: COPPER_BLANK,
      gap: q(0.5, 'mm'),
    });
    expectProblem(res, 400, '/body/bank/capacitance/value');
  });

  it('POST /estimates/launch of a 60 mm blank in two coarse rings 0.4 mm above a one-ring coil: 422 on /body/filaments (was 500: 1e148 A from a 33 J bank, null in JSON)', async () => {
    const res = await post('/estimates/launch', {
      bank: {
        capacitance: q(2950, 'uF'),
        voltage: q(150, 'V'),
        seriesResistance: q(28.4, 'mohm'),
      },
      coil: {
        innerRadius: q(1.37, 'mm'),
        outerRadius: q(13.2, 'mm'),
        length: q(1.36, 'mm'),
        turns: 13,
      },
      blank: {
        diameter: q(60, 'mm'),
        layers: [{ material: { alloy: 'aluminium-1100-o' }, thickness: q(0.515, 'mm') }],
      },
      gap: q(0.418, 'mm'),
      filaments: { coilRadial: 1, coilAxial: 2, blankRadial: 2, blankPerLayer: 1 },
    });
    expectProblem(res, 422, '/body/filaments');
  });

  it('POST /estimates/launch of a 5 mm aluminium slug under the default filaments: 422 on /body/blank (was a 200 leaving 56 times the energy stored)', async () => {
    const res = await post('/estimates/launch', {
      bank: { capacitance: q(1000, 'uF'), voltage: q(400, 'V'), seriesResistance: q(10, 'mohm') },
      coil: { innerRadius: q(2, 'mm'), outerRadius: q(12, 'mm'), length: q(5, 'mm'), turns: 20 },
      blank: {
        diameter: q(20, 'mm'),
        layers: [{ material: { alloy: 'aluminium-1100-o' }, thickness: q(5, 'mm') }],
      },
      gap: q(0.5, 'mm'),
    });
    expectProblem(res, 422, '/body/blank');
    expect(res.body.detail).toMatch(/blankPerLayer/);
  });
});
