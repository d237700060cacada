import { citationCoverage, citedValuesOf } from '../../shared/catalogue/citation-coverage';
import type { EngineCheck } from '../../shared/checks/engine-checks';
import type { EstimatePool } from '../estimates/pool';
import type { CatalogueStore } from './catalogue-store';

export interface ChecksReport {
  engine: EngineCheck[];
  table: ReturnType<typeof tableCoverage>;
}

/** The table part of the report: the live table's counts (openapi.yaml `Checks.table`). */
function tableCoverage(coverage: ReturnType<typeof citationCoverage>) {
  const { values, cited, fromMemory, byKind } = coverage;
  return { values, cited, fromMemory, byKind };
}

/**
 * GET /api/v1/checks. The engine checks are recomputed by this process (on a worker thread) on the
 * first call and kept: their inputs are fixed, so the answer cannot change while the code does
 * not. Concurrent first calls share one run; a failed run is forgotten so that the next call tries
 * again. The table's coverage is counted afresh from the catalogue, which curation keeps current.
 */
export function createChecksService(pool: EstimatePool, catalogue: CatalogueStore) {
  let engine: Promise<EngineCheck[]> | undefined;
  const engineChecks = () => {
    engine ??= (pool.run({ kind: 'checks' }) as Promise<EngineCheck[]>).catch((error: unknown) => {
      engine = undefined;
      throw error;
    });
    return engine;
  };
  return {
    async report(): Promise<ChecksReport> {
      const [checks, table] = await Promise.all([engineChecks(), catalogue.get()]);
      return {
        engine: checks,
        table: tableCoverage(citationCoverage(citedValuesOf(table.all()))),
      };
    },
  };
}

export type ChecksService = ReturnType<typeof createChecksService>;
