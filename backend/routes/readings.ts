import { Router } from 'express';
import type { ReadingRepository } from '../db/reading-repository';

export function readingsRouter(readings: ReadingRepository): Router {
  const router = Router({ caseSensitive: true, strict: true });
  router.get('/readings', async (_req, res) => {
    res.json({ items: await readings.list() });
  });
  return router;
}
