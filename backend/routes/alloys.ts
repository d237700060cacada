import { Router, type Request } from 'express';
import type { AlloyRecord } from '../../shared/catalogue/alloy-record';
import { ProblemError } from '../http/problem';
import { sendPreparedJson } from '../http/send-prepared-json';
import type { CatalogueQuery, CatalogueItem } from '../services/catalogue';
import type { CatalogueStore } from '../services/catalogue-store';
import type { ReleaseService } from '../services/releases';

export interface Measurement {
  conductivitySPerM: number;
  frequencyHz: number;
  temperatureK: number;
  uncertaintyPercent: number;
  sample: string;
  instrument: string;
  source: { id: number; citation: string; kind: string };
}

/** Query values arrive as strings (already checked against openapi.yaml); turn them into types. */
function parseQuery(req: Request): CatalogueQuery {
  const q = req.query as Record<string, string | string[] | undefined>;
  const num = (name: string) => (q[name] === undefined ? undefined : Number(q[name]));
  const family = q.family === undefined ? undefined : ([] as string[]).concat(q.family);
  return {
    q: typeof q.q === 'string' ? q.q : undefined,
    family,
    magnetic: q.magnetic === undefined ? undefined : String(q.magnetic) === 'true',
    conductivityMin: num('conductivityMin'),
    conductivityMax: num('conductivityMax'),
    conductivityUnit: typeof q.conductivityUnit === 'string' ? q.conductivityUnit : undefined,
    densityMin: num('densityMin'),
    densityMax: num('densityMax'),
    densityUnit: typeof q.densityUnit === 'string' ? q.densityUnit : undefined,
    sort: typeof q.sort === 'string' ? q.sort : undefined,
    limit: num('limit') ?? 25,
    offset: num('offset') ?? 0,
  };
}

function detail(record: AlloyRecord, item: CatalogueItem) {
  return {
    ...item,
    aliases: record.aliases ?? [],
    composition: Object.entries(record.composition).map(([element, massPercent]) => ({
      element,
      massPercent,
    })),
    condition: record.condition,
    notes: record.notes,
    values: record.values,
  };
}

export function alloysRouter(
  catalogue: CatalogueStore,
  releases: ReleaseService,
  measurementsOf: (slug: string) => Promise<Measurement[]>,
): Router {
  const router = Router({ caseSensitive: true, strict: true });
  /** The live table, or the one a release froze (`?release=2026.12.0`). */
  const tableFor = (req: Request) =>
    typeof req.query.release === 'string' ? releases.catalogue(req.query.release) : catalogue.get();

  router.get('/alloys', async (req, res) => {
    const table = await tableFor(req);
    sendPreparedJson(req, res, table.searchAnswer(parseQuery(req)));
  });

  router.get('/alloys/:slug', async (req, res) => {
    const table = await tableFor(req);
    const slug = String(req.params.slug);
    const found = table.find(slug);
    if (!found) throw new ProblemError(404, 'Not found', `No alloy '${slug}' in the table`);
    const measured = typeof req.query.release === 'string' ? [] : await measurementsOf(slug);
    res.json({ ...detail(found.record, found.item), measurements: measured });
  });

  return router;
}
