import Ajv, { type ValidateFunction } from 'ajv';
import fc from 'fast-check';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { loadApiDocument } from '../../../backend/api-document';
import { createEstimatePool, type EstimatePool } from '../../../backend/estimates/pool';
import { demoAccounts } from '../../../seeds/demo/accounts';
import { signedIn } from '../../helpers/access';
import { createTestApp, type TestApp } from '../../helpers/test-app';
import {
  describeRequest,
  describeResponse,
  operationsOf,
  requestArb,
  send,
  type FuzzRequest,
  type Operation,
} from './requests';
import {
  deref,
  toJsonSchema,
  type GenOptions,
  type OpenApiDocument,
  type Schema,
} from './schema-arbitraries';

/**
 * quality.md, "Fuzz": requests generated from openapi.yaml with fast-check, for every operation,
 * as a visitor and as the demo admin; 0 responses 5xx, every 4xx a problem+json, every 2xx body
 * valid against the operation's response schema, 0 unhandled rejections.
 *
 * Replay a run with FUZZ_SEED=<seed>: the seed printed at the start and in every test's name
 * (each test adds its place in openapi.yaml to it; fast-check's own message shows that sum). More
 * runs with FUZZ_RUNS=<n>, every 4xx and 422 reason with FUZZ_VERBOSE=1. The operations share
 * one app, as a deployment would: what an earlier one changed (a revoked key, a disabled
 * account) is part of the input of later ones, so replay the whole file, not one test.
 */
const SEED = process.env.FUZZ_SEED
  ? Number(process.env.FUZZ_SEED)
  : Math.floor(Math.random() * 2 ** 31);
const RUNS = Math.max(100, Number(process.env.FUZZ_RUNS ?? 100));
/** The calculators' budget in this app: enough for the modest inputs below, small enough to keep the file quick. */
const COMPUTE_LIMIT_MS = 300;

const doc = loadApiDocument() as unknown as OpenApiDocument;
const operations = operationsOf(doc);

/**
 * Sizes kept modest where the engine's cost grows with them (few frequencies, layers and
 * filaments); the schemas' own limits are exercised by tests/api/security/api4-resource-consumption.
 */
const OVERRIDES: Record<string, Schema> = {
  '/filaments/coilRadial': { type: 'integer', minimum: 1, maximum: 2 },
  '/filaments/coilAxial': { type: 'integer', minimum: 1, maximum: 2 },
  '/filaments/blankRadial': { type: 'integer', minimum: 2, maximum: 3 },
  '/filaments/blankPerLayer': { type: 'integer', minimum: 1, maximum: 1 },
};

type Json = Record<string, unknown>;
const METRES: Record<string, number> = {
  m: 1,
  mm: 1e-3,
  um: 1e-6,
  µm: 1e-6,
  μm: 1e-6,
  in: 0.0254,
  mil: 2.54e-5,
};
const metres = (q: unknown) => {
  const { value, unit } = q as { value: number; unit: string };
  return value * (METRES[unit] ?? NaN);
};

/**
 * What a schema cannot say but a calculation needs, applied to the valid bodies (mutations come
 * after): an outer radius beyond the inner, a wire diameter or an AWG, a half-space only last, a
 * density on every layer of a blank. Without it nine in ten valid estimate bodies were 400s.
 */
function refineEstimate(body: unknown): unknown {
  const b = body as Json;
  const coil = b.coil as Json | undefined;
  if (coil) {
    if (metres(coil.outerRadius) <= metres(coil.innerRadius))
      [coil.innerRadius, coil.outerRadius] = [coil.outerRadius, coil.innerRadius];
    if (metres(coil.outerRadius) <= metres(coil.innerRadius))
      (coil.innerRadius as Json).value = ((coil.outerRadius as Json).value as number) / 2;
    if (coil.wireDiameter && coil.awg !== undefined) delete coil.awg;
  }
  const layers = b.layers as Json[] | undefined;
  layers?.forEach((layer, i) => {
    if (i < layers.length - 1 && 'halfSpace' in layer) {
      delete layer.halfSpace;
      layer.thickness = { value: 1, unit: 'mm' };
    }
  });
  for (const layer of ((b.blank as Json | undefined)?.layers as Json[] | undefined) ?? []) {
    const material = layer.material as Json;
    if (material.conductivity && !material.density)
      material.density = { value: 8.9, unit: 'g/cm3' };
  }
  return b;
}

/** A practitioner's figure, within a factor of three either way. */
const near = (value: number, unit: string) =>
  fc
    .double({ min: 1 / 3, max: 3, noNaN: true })
    .map((k) => ({ value: Number((value * k).toPrecision(3)), unit }));
const sensorCoil = fc.record({
  innerRadius: near(2, 'mm'),
  outerRadius: near(6, 'mm'),
  length: near(2, 'mm'),
  turns: fc.integer({ min: 10, max: 4000 }),
});
/** Tables alloys by slug (filled in once the app is up) or a conductivity of one's own. */
let alloySlugs: string[] = ['copper-c11000'];
const material = fc.oneof(
  fc.constant(null).map(() => ({ alloy: alloySlugs[0]! })),
  fc.nat().map((i) => ({ alloy: alloySlugs[i % alloySlugs.length]! })),
  near(20, 'MS/m').map((conductivity) => ({
    conductivity,
    density: { value: 8.9, unit: 'g/cm3' },
  })),
);
const frequencies = fc.array(near(10, 'kHz'), { minLength: 1, maxLength: 3 });
const PLAUSIBLE: Record<string, fc.Arbitrary<unknown>> = {
  '/estimates/impedance': fc.record({
    coil: sensorCoil,
    liftOff: near(0.5, 'mm'),
    layers: fc.array(fc.record({ material, thickness: near(0.5, 'mm') }), {
      minLength: 1,
      maxLength: 3,
    }),
    frequencies,
  }),
  '/estimates/launch': fc.record({
    bank: fc.record({
      capacitance: near(1000, 'uF'),
      voltage: near(300, 'V'),
      seriesResistance: near(20, 'mohm'),
    }),
    coil: fc.record({
      innerRadius: near(3, 'mm'),
      outerRadius: near(12, 'mm'),
      length: near(4, 'mm'),
      turns: fc.integer({ min: 5, max: 40 }),
    }),
    blank: fc.record({
      diameter: near(20, 'mm'),
      layers: fc.array(fc.record({ material, thickness: near(0.6, 'mm') }), {
        minLength: 1,
        maxLength: 2,
      }),
    }),
    gap: near(0.5, 'mm'),
    filaments: fc.record({
      coilRadial: fc.integer({ min: 1, max: 2 }),
      coilAxial: fc.integer({ min: 1, max: 2 }),
      blankRadial: fc.integer({ min: 2, max: 3 }),
      blankPerLayer: fc.constant(1),
    }),
  }),
};
PLAUSIBLE['/estimates/apparent-conductivity'] = PLAUSIBLE['/estimates/impedance']!;

// Ajv is express-openapi-validator's own dependency (no package added for it). The app itself
// validates its responses too (validateResponses: true), so a body that breaks its schema would
// also surface as a 500 below; this check says which field.
const ajv = new Ajv({ strict: false, allErrors: true, validateFormats: false });
const validators = new Map<string, ValidateFunction | null>();
const validateProblem = ajv.compile(
  toJsonSchema(doc, { $ref: '#/components/schemas/Problem' }) as object,
);

function responseValidator(op: Operation, status: number, mediaType: string) {
  const key = `${op.method} ${op.template} ${status} ${mediaType}`;
  if (!validators.has(key)) {
    const responses = op.definition.responses as Record<string, unknown>;
    const raw = responses[String(status)];
    const response = raw ? deref<Schema>(doc, raw) : undefined;
    const content = response?.content as Record<string, { schema?: unknown }> | undefined;
    const schema = content?.[mediaType]?.schema;
    validators.set(key, schema ? ajv.compile(toJsonSchema(doc, schema) as object) : null);
  }
  return validators.get(key)!;
}

function documentedMediaTypes(op: Operation, status: number): string[] | undefined {
  const raw = (op.definition.responses as Record<string, unknown>)[String(status)];
  if (!raw) return undefined;
  const content = deref<Schema>(doc, raw).content as Record<string, unknown> | undefined;
  return content ? Object.keys(content) : [];
}

/** What is wrong with a response, or null. */
function verdict(op: Operation, res: request.Response): string | null {
  const type = String(res.headers['content-type'] ?? '');
  const mediaType = type.split(';')[0]!.trim();
  if (res.status >= 500) return `a ${res.status}`;
  if (res.status >= 400) {
    if (mediaType !== 'application/problem+json')
      return `a ${res.status} as ${type || 'no content type'}`;
    return validateProblem(res.body)
      ? null
      : `a ${res.status} whose problem breaks its schema: ${ajv.errorsText(validateProblem.errors)}`;
  }
  if (res.status >= 200 && res.status < 300) {
    const documented = documentedMediaTypes(op, res.status);
    // 'default' is the problem response: a success must be listed under its own status.
    if (documented === undefined) return `an undocumented ${res.status}`;
    if (!documented.length) return null;
    if (!documented.includes(mediaType))
      return `a ${res.status} as ${type}, not ${documented.join(' or ')}`;
    const validate = responseValidator(op, res.status, mediaType);
    if (validate && mediaType === 'application/json' && !validate(res.body))
      return `a ${res.status} whose body breaks its schema: ${ajv.errorsText(validate.errors)}`;
  }
  return null;
}

let t: TestApp;
let pool: EstimatePool;
let admin: Awaited<ReturnType<typeof signedIn>>;
/** Set when the admin's session has ended (a fuzzed sign-out): sign in again before the next request. */
let adminStale = false;
let signIns = 0;
let unhandled = 0;
const onUnhandled = () => {
  unhandled++;
};
const tally = { requests: 0, fiveHundreds: 0, byStatus: new Map<number, number>() };
/** Statuses per operation and role, printed with FUZZ_VERBOSE=1 to see what the inputs reach. */
const perOperation = new Map<string, Map<number, number>>();
const reasons = new Map<string, number>();
let hints: GenOptions['hints'];

beforeAll(async () => {
  process.on('unhandledRejection', onUnhandled);
  console.log(`fuzz seed ${SEED}: replay with FUZZ_SEED=${SEED}`);
  pool = createEstimatePool({ computeLimitMs: COMPUTE_LIMIT_MS, threads: 1 });
  t = await createTestApp({
    accounts: true,
    estimatePool: pool,
    estimateLimits: { visitor: 1e6, reader: 1e6, integrator: 1e6, curator: 1e6, admin: 1e6 },
  });
  admin = await signedIn(t.app, 'admin');
  const alloys = await request(t.app).get('/api/v1/alloys?limit=100');
  const slugs = (alloys.body.items as Array<{ slug: string }>).map((a) => a.slug);
  alloySlugs = slugs;
  hints = {
    slug: slugs,
    alloy: slugs,
    email: demoAccounts.map((a) => a.email),
    id: [1, 2, 3, 4, 5],
  };
});

afterAll(async () => {
  process.off('unhandledRejection', onUnhandled);
  await pool?.close();
  await t?.knex.destroy();
  const histogram = (m: Map<number, number>) =>
    [...m]
      .sort(([a], [b]) => a - b)
      .map(([s, n]) => `${s}×${n}`)
      .join(' ');
  if (process.env.FUZZ_VERBOSE)
    for (const [key, counts] of perOperation) console.log(`${key}: ${histogram(counts)}`);
  if (process.env.FUZZ_VERBOSE) for (const [why, n] of reasons) console.log(`${n}× ${why}`);
  const statuses = histogram(tally.byStatus);
  console.log(
    `fuzz: ${operations.length} operations × 2 roles × ${RUNS} runs: ${tally.requests} requests, ${tally.fiveHundreds} 5xx, ${signIns} admin sign-ins; ${statuses}`,
  );
});

async function fuzz(op: Operation, role: 'visitor' | 'admin', seed: number) {
  const arb = requestArb(
    doc,
    op,
    { maxItems: 3, overrides: OVERRIDES, hints, hintOdds: { alloy: 4, slug: 2 } },
    op.template.startsWith('/estimates/')
      ? { refine: refineEstimate, plausible: PLAUSIBLE[op.template] }
      : {},
  );
  let run = 0;
  await fc.assert(
    fc.asyncProperty(arb, async (req: FuzzRequest) => {
      // A sign-in costs a bcrypt hash (~0.2 s): after a fuzzed sign-out, most runs go on with the
      // revoked session (itself a case worth sending), one in ten with a fresh one.
      const resume = op.template !== '/auth/sign-out' || run % 10 === 0;
      run++;
      if (role === 'admin' && adminStale && resume) {
        admin = await signedIn(t.app, 'admin');
        adminStale = false;
        signIns++;
      }
      const client = role === 'admin' ? admin : request(t.app);
      const before = unhandled;
      const res = await send(client as never, req);
      tally.requests++;
      tally.byStatus.set(res.status, (tally.byStatus.get(res.status) ?? 0) + 1);
      const key = `${op.method.toUpperCase()} ${op.template} as ${role}`;
      const counts = perOperation.get(key) ?? new Map<number, number>();
      perOperation.set(key, counts.set(res.status, (counts.get(res.status) ?? 0) + 1));
      if (process.env.FUZZ_VERBOSE && (res.status === 422 || res.status === 400)) {
        const why = `${key} ${res.status}: ${String(res.body?.detail).slice(0, 90)}`;
        reasons.set(why, (reasons.get(why) ?? 0) + 1);
      }
      if (res.status >= 500) tally.fiveHundreds++;
      // A 401 from sign-in is a wrong password, not a lost session.
      const lost = res.status === 401 && op.template !== '/auth/sign-in';
      if (role === 'admin' && (lost || (op.template === '/auth/sign-out' && res.status < 300)))
        adminStale = true;
      const problem = verdict(op, res);
      if (problem || unhandled !== before)
        throw new Error(
          `${role}: ${problem ?? 'an unhandled rejection'}\n${describeRequest(req)}\n→ ${describeResponse(res)}`,
        );
    }),
    // Shrinking a failure re-sends requests (a launch can take the whole compute limit each):
    // bounded, it still reports the smallest failure found by then.
    { numRuns: RUNS, seed, interruptAfterTimeLimit: 60_000, markInterruptAsFailure: false },
  );
  // An interrupt before a failure would pass quietly with fewer runs.
  expect(run, 'requests sent before the time limit').toBeGreaterThanOrEqual(RUNS);
}

describe(`every operation of openapi.yaml, fuzzed (seed ${SEED})`, () => {
  operations.forEach((op, i) => {
    (['visitor', 'admin'] as const).forEach((role, j) => {
      // Each test its own seed, derived from its place in openapi.yaml: the same under -t.
      const seed = (SEED + 2 * i + j) | 0;
      it(
        `${op.method.toUpperCase()} ${op.template} as ${role}`,
        () => fuzz(op, role, seed),
        120_000,
      );
    });
  });

  it('left no unhandled rejections behind', () => {
    expect(unhandled).toBe(0);
  });
});
