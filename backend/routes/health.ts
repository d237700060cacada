import { Router } from 'express';
import type { Knex } from 'knex';
import { dialectOf } from '../db/dialect';
import type { CatalogueStore } from '../services/catalogue-store';

/**
 * GET /health for people and for a load balancer's checks: it asks the database a question every
 * time (the catalogue alone may be answered from memory), so a proxy takes an instance whose
 * database is gone out of rotation.
 */
export function healthRouter(catalogue: CatalogueStore, knex: Knex, version: string): Router {
  const router = Router({ caseSensitive: true, strict: true });
  router.get('/health', async (_req, res) => {
    // A failure here (or before: the session lookup, the limits' store) is a 503 (problem.ts).
    await knex.raw('SELECT 1');
    const table = await catalogue.get();
    res.json({ status: 'ok', version, database: dialectOf(knex), alloys: table.size });
  });
  return router;
}
