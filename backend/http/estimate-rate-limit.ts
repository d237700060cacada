import type { RequestHandler } from 'express';
import { ipKeyGenerator } from 'express-rate-limit';
import type { Caller } from '../auth/roles';
import type { LimiterStores } from './knex-rate-limit-store';
import { ProblemError } from './problem';
import { windowLimiter } from './window-limiter';

/**
 * Calculations per minute by caller, on top of the general limit: one launch costs as much CPU
 * as thousands of look-ups, so an anonymous address gets a few a minute, not a hundred.
 */
export type EstimateLimits = Record<Caller, number>;
export const DEFAULT_ESTIMATE_LIMITS: EstimateLimits = {
  visitor: 20,
  reader: 120,
  integrator: 600,
  curator: 240,
  admin: 240,
};

/**
 * Applies to the calculations (POSTs tagged `estimates` in openapi.yaml) and to other heavy
 * operations (`x-heavy: true`, e.g. a batch Match, counted as one); others pass untouched.
 */
export function estimateRateLimit(
  limits: EstimateLimits,
  stores: LimiterStores = () => undefined,
): RequestHandler {
  const limiter = windowLimiter({
    store: stores('estimates'),
    windowMs: 60_000,
    limit: (req) => limits[req.principal.role],
    key: (req) => {
      const p = req.principal;
      if (p.kind === 'key') return `estimates:key:${p.keyId}`;
      if (p.kind === 'session') return `estimates:user:${p.userId}`;
      return `estimates:ip:${ipKeyGenerator(req.ip ?? '')}`;
    },
    refuse: (_req, retryAfterS) =>
      new ProblemError(
        429,
        'Too many requests',
        `Calculations are limited for your role: try again in ${retryAfterS} s, or sign in or use an API key for a higher allowance.`,
      ),
  });
  return (req, res, next) =>
    req.method === 'POST' && (req.operation?.tags.includes('estimates') || req.operation?.heavy)
      ? limiter(req, res, next)
      : next();
}
