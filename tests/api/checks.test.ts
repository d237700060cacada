import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createEstimatePool, type EstimatePool } from '../../backend/estimates/pool';
import { citationCoverage } from '../../shared/catalogue/citation-coverage';
import { ENGINE_CHECK_GROUPS } from '../../shared/checks/engine-checks';
import { referenceValues } from '../../seeds/01_reference_table';
import { createTestApp, type TestApp } from '../helpers/test-app';

/** The calculators' pool, counting the jobs it is given, so the cache can be seen working. */
function countingPool(): { pool: EstimatePool; jobs: string[] } {
  const inner = createEstimatePool({ threads: 1 });
  const jobs: string[] = [];
  return {
    jobs,
    pool: {
      ...inner,
      computeLimitMs: inner.computeLimitMs,
      run: (job) => {
        jobs.push(job.kind);
        return inner.run(job);
      },
      load: () => inner.load(),
      close: () => inner.close(),
    },
  };
}

let t: TestApp;
let counting: ReturnType<typeof countingPool>;
beforeAll(async () => {
  counting = countingPool();
  t = await createTestApp({ estimatePool: counting.pool });
});
afterAll(async () => {
  await counting.pool.close();
  await t.knex.destroy();
});

const ROW_KEYS = [
  'id',
  'title',
  'quantity',
  'ours',
  'reference',
  'unit',
  'relativeDifference',
  'tolerance',
  'pass',
  'source',
].sort();

interface Row {
  id: string;
  ours: number;
  reference: number;
  relativeDifference: number;
  tolerance: number;
  pass: boolean;
  source: string;
  unit: string;
}

describe('GET /api/v1/checks', () => {
  let first: request.Response;
  beforeAll(async () => {
    first = await request(t.app).get('/api/v1/checks');
  }, 60_000);

  it('answers a visitor with 200 and JSON', () => {
    expect(first.status, JSON.stringify(first.body)).toBe(200);
    expect(first.type).toBe('application/json');
    expect(Object.keys(first.body).sort()).toEqual(['engine', 'table']);
  });

  it('lists every engine check with ours, the reference, the difference, the tolerance and the source', () => {
    const rows = first.body.engine as Row[];
    // TEAM 15-1 (4), skin depths (4), Maxwell (2 + 8 × 2), apparent conductivity (5), launch (1).
    expect(rows).toHaveLength(4 + 4 + 18 + 5 + 1 + 3);
    expect(new Set(rows.map((r) => r.id)).size).toBe(rows.length);
    for (const r of rows) {
      expect(Object.keys(r).sort(), r.id).toEqual(ROW_KEYS);
      for (const k of ['ours', 'reference', 'relativeDifference', 'tolerance'] as const)
        expect(Number.isFinite(r[k]), `${r.id} ${k}`).toBe(true);
      expect(r.relativeDifference).toBeCloseTo(
        Math.abs(r.ours - r.reference) / Math.abs(r.reference),
        15,
      );
      expect(r.source.length, r.id).toBeGreaterThan(10);
      expect(r.unit).toMatch(/^(H|ohm|m|S\/m|H\/m|J|1)$/);
    }
  });

  it('passes every engine check', () => {
    const failing = (first.body.engine as Row[]).filter((r) => !r.pass);
    expect(
      failing.map(
        (r) => `${r.id}: ${r.ours} vs ${r.reference}, ${r.relativeDifference} ≥ ${r.tolerance}`,
      ),
    ).toEqual([]);
  });

  it('names the sources the unit tests name (one module, shared/checks/references.ts)', () => {
    const sources = new Set((first.body.engine as Row[]).map((r) => r.source));
    expect([...sources].some((s) => s.startsWith('TEAM Workshop Problem 15-1'))).toBe(true);
    expect([...sources].some((s) => s.startsWith('mpmath'))).toBe(true);
    expect(ENGINE_CHECK_GROUPS.map((g) => g.name)).toContain('Launch energy ledger');
  });

  it('computes the engine checks once, on a worker thread, and serves the second call from the cache', async () => {
    expect(counting.jobs).toEqual(['checks']);
    const second = await request(t.app).get('/api/v1/checks');
    expect(second.status).toBe(200);
    expect(second.body.engine).toEqual(first.body.engine);
    expect(counting.jobs).toEqual(['checks']);
  });

  it('counts the table as the shared coverage count does (the seed, as loaded)', () => {
    const coverage = citationCoverage(referenceValues());
    expect(first.body.table).toEqual({
      values: coverage.values,
      cited: coverage.cited,
      fromMemory: coverage.fromMemory,
      byKind: coverage.byKind,
    });
    expect(first.body.table.cited + first.body.table.fromMemory).toBe(first.body.table.values);
  });

  it('refuses a query parameter it does not define (400)', async () => {
    const res = await request(t.app).get('/api/v1/checks?fresh=1');
    expect(res.status).toBe(400);
    expect(res.type).toBe('application/problem+json');
  });

  it('refuses another method (405) and another spelling (404)', async () => {
    expect((await request(t.app).post('/api/v1/checks').send({})).status).toBe(405);
    expect((await request(t.app).get('/api/v1/Checks')).status).toBe(404);
    expect((await request(t.app).get('/api/v1/checks/')).status).toBe(404);
  });
});

describe('GET /api/v1/checks on a server with a tight limit for calculations', () => {
  it('still answers: the checks have fixed inputs and their own limit (CHECKS_COMPUTE_LIMIT_MS)', async () => {
    const tight = createEstimatePool({ threads: 1, computeLimitMs: 20 });
    const other = await createTestApp({ estimatePool: tight });
    try {
      const res = await request(other.app).get('/api/v1/checks');
      expect(res.status, JSON.stringify(res.body)).toBe(200);
      expect((res.body.engine as Row[]).every((r) => r.pass)).toBe(true);
    } finally {
      await tight.close();
      await other.knex.destroy();
    }
  }, 60_000);
});
