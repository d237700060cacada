import { Router } from 'express';
import type { ChecksService } from '../services/checks';

export function checksRouter(checks: ChecksService): Router {
  const router = Router({ caseSensitive: true, strict: true });
  router.get('/checks', async (_req, res) => {
    res.json(await checks.report());
  });
  return router;
}
