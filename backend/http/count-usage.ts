import type { RequestHandler } from 'express';
import type { AccountRepositories } from '../db/account-repositories';

/** The route group of an API path: /api/v1/estimates/launch → estimates. */
export function routeGroup(path: string): string {
  return path.replace(/^\/api\/v1\/?/, '').split('/')[0] || 'root';
}

/** Counts each answered request made with an API key, per key, per day (UTC), per route group. */
export function countUsage(repos: AccountRepositories): RequestHandler {
  return (req, res, next) => {
    const p = req.principal;
    if (p.kind === 'key') {
      res.on('finish', () => {
        void repos.usage
          .increment(
            p.keyId,
            new Date().toISOString().slice(0, 10),
            routeGroup(req.originalUrl.split('?')[0]!),
          )
          .catch(() => undefined);
      });
    }
    next();
  };
}
