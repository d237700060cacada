import path from 'node:path';
import express, { type Router } from 'express';

/** A year: Vite names every built asset by its content hash, so a changed file is a new URL. */
const HASHED_MAX_AGE_S = 365 * 24 * 3600;

/**
 * The built front end. Hashed assets (dist/client/assets/*) are cached for a year and marked
 * immutable; index.html is revalidated on every visit, so a new release is seen at once; the
 * few unhashed files (fonts' licence, icons) get an hour. Every other GET is a front-end route:
 * the React router takes it from index.html.
 */
export function staticClient(clientDist: string): Router {
  const router = express.Router({ caseSensitive: true, strict: true });
  const index = path.join(clientDist, 'index.html');
  router.use(
    '/assets',
    express.static(path.join(clientDist, 'assets'), {
      index: false,
      fallthrough: false,
      immutable: true,
      maxAge: HASHED_MAX_AGE_S * 1000,
    }),
  );
  router.use(express.static(clientDist, { index: false, maxAge: '1h' }));
  router.get('/{*splat}', (_req, res) => {
    res.setHeader('Cache-Control', 'no-cache');
    res.sendFile(index);
  });
  return router;
}
