import { Router } from 'express';
import type { CatalogueStore } from '../services/catalogue-store';

export function healthRouter(catalogue: CatalogueStore, version: string): Router {
  const router = Router({ caseSensitive: true, strict: true });
  router.get('/health', async (_req, res) => {
    const table = await catalogue.get();
    res.json({ status: 'ok', version, alloys: table.size });
  });
  return router;
}
