import type { RequestHandler } from 'express';
import { ipKeyGenerator, rateLimit } from 'express-rate-limit';
import type { Caller } from '../auth/roles';
import { ProblemError } from './problem';

/** Requests per minute by caller; visitors are counted per address, the others per key or person. */
export type RateLimits = Record<Caller, number>;
export const DEFAULT_RATE_LIMITS: RateLimits = {
  visitor: 120,
  reader: 600,
  integrator: 3000,
  curator: 1200,
  admin: 1200,
};

const tooMany = (retryAfterS: number) =>
  new ProblemError(429, 'Too many requests', `Slow down: try again in ${retryAfterS} s.`);

/** One limiter for the API, with RateLimit headers (IETF draft 8) and Retry-After on 429. */
export function apiRateLimit(limits: RateLimits): RequestHandler {
  return rateLimit({
    windowMs: 60_000,
    limit: (req) => limits[req.principal.role],
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    keyGenerator: (req) => {
      const p = req.principal;
      if (p.kind === 'key') return `key:${p.keyId}`;
      if (p.kind === 'session') return `user:${p.userId}`;
      return `ip:${ipKeyGenerator(req.ip ?? '')}`;
    },
    handler: (_req, res, next) => next(tooMany(Number(res.getHeader('retry-after') ?? 60))),
  });
}

/**
 * Sign-in and password-reset throttles, per address and per account, so that guessing is slow
 * however it is spread. The account key is the e-mail as given, whether or not it exists.
 */
export function credentialThrottles(
  perAddress: number,
  perAccount: number,
  windowMs = 15 * 60_000,
): RequestHandler[] {
  const common = { windowMs, standardHeaders: 'draft-8' as const, legacyHeaders: false };
  return [
    rateLimit({
      ...common,
      limit: perAddress,
      keyGenerator: (req) => `ip:${ipKeyGenerator(req.ip ?? '')}`,
      handler: (_r, res, next) => next(tooMany(Number(res.getHeader('retry-after') ?? 60))),
    }),
    rateLimit({
      ...common,
      limit: perAccount,
      keyGenerator: (req) =>
        `account:${String((req.body as { email?: unknown } | undefined)?.email ?? '').toLowerCase()}`,
      handler: (_r, res, next) => next(tooMany(Number(res.getHeader('retry-after') ?? 60))),
    }),
  ];
}
