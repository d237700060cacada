import type { Request, RequestHandler } from 'express';
import { ipKeyGenerator } from 'express-rate-limit';
import type { Caller } from '../auth/roles';
import type { LimiterStores } from './knex-rate-limit-store';
import { ProblemError } from './problem';
import { windowLimiter } from './window-limiter';

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

/** One limiter for the API, with RateLimit headers (IETF draft 8) and Retry-After on 429 (window-limiter.ts). */
export function apiRateLimit(
  limits: RateLimits,
  stores: LimiterStores = () => undefined,
): RequestHandler {
  return windowLimiter({
    store: stores('api'),
    windowMs: 60_000,
    limit: (req) => limits[req.principal.role],
    key: (req) => {
      const p = req.principal;
      if (p.kind === 'key') return `key:${p.keyId}`;
      if (p.kind === 'session') return `user:${p.userId}`;
      return `ip:${ipKeyGenerator(req.ip ?? '')}`;
    },
    refuse: (_req, retryAfterS) => tooMany(retryAfterS),
  });
}

/** Sign-in, sign-up and reset attempts allowed per window (15 minutes unless a test says). */
export interface CredentialLimits {
  /** From one address, whatever the account: slows one machine trying many accounts. */
  perAddress: number;
  /** For one account from one address: the usual lock-out, which a stranger elsewhere cannot cause. */
  perAccount: number;
  /**
   * For one account from every address together: a ceiling against guessing spread over many
   * addresses. Ten times perAccount (at least 100) unless given.
   */
  perAccountCeiling?: number;
}

export const DEFAULT_CREDENTIAL_LIMITS: Required<CredentialLimits> = {
  perAddress: 30,
  perAccount: 10,
  perAccountCeiling: 100,
};

/**
 * Sign-in and password-reset throttles (quality.md: per account and per address). The account is
 * the e-mail as given, whether or not it exists. The account limit is keyed on the account and the
 * address together, so a stranger's failures lock out the stranger and not the owner (a lock-out
 * per account alone lets anyone deny the owner: OWASP Authentication Cheat Sheet, account
 * lockout); the ceiling per account alone still caps guessing spread over many addresses. The
 * numbers are common practice, no source.
 */
export function credentialThrottles(
  limits: CredentialLimits,
  windowMs = 15 * 60_000,
  stores: LimiterStores = () => undefined,
): RequestHandler[] {
  const ceiling = limits.perAccountCeiling ?? Math.max(100, 10 * limits.perAccount);
  const common = { windowMs, refuse: (_req: Request, retryAfterS: number) => tooMany(retryAfterS) };
  const address = (req: Request) => `ip:${ipKeyGenerator(req.ip ?? '')}`;
  const account = (req: Request) =>
    `account:${String((req.body as { email?: unknown } | undefined)?.email ?? '').toLowerCase()}`;
  return [
    windowLimiter({
      ...common,
      store: stores('credentials-address'),
      limit: () => limits.perAddress,
      key: address,
    }),
    windowLimiter({
      ...common,
      store: stores('credentials-account-address'),
      limit: () => limits.perAccount,
      key: (req) => `${account(req)}|${address(req)}`,
    }),
    windowLimiter({
      ...common,
      store: stores('credentials-account'),
      limit: () => ceiling,
      key: account,
    }),
  ];
}
