import type { CookieOptions, RequestHandler } from 'express';
import type { AccountRepositories } from '../db/account-repositories';
import { ProblemError } from '../http/problem';
import { hashApiKey, KEY_PREFIX } from './api-keys';
import { roleRank, type Role } from './roles';
import { crossSiteWriteRefusal } from './same-origin';
import { ACCESS_TOKEN_SECONDS, SESSION_COOKIE, signSession, verifySession } from './session-tokens';

/** Re-issue the short-lived cookie once it is this old, so an active person stays signed in. */
const REFRESH_AFTER_SECONDS = 5 * 60;
const KEY_TOUCH_MS = 60_000;

export function sessionCookieOptions(production: boolean): CookieOptions {
  return {
    httpOnly: true,
    sameSite: 'strict',
    secure: production,
    path: '/',
    maxAge: ACCESS_TOKEN_SECONDS * 1000,
  };
}

const lower = (a: Role, b: Role): Role => (roleRank(a) <= roleRank(b) ? a : b);

/**
 * Sets req.principal. An `Authorization: Bearer cdy_…` header must carry a live API key (a bad
 * one is a 401 at once: a machine should hear that its key failed). A session cookie must carry
 * a valid JWT of a live session; a bad or stale cookie leaves the caller a visitor, with the
 * reason kept, so that public pages still work and protected ones answer 401. A write with a
 * valid cookie must come from this service's own origin (same-origin.ts): PUBLIC_URL's when it is
 * configured, else the request's own scheme, host and port. Keys never set a cookie: they cannot
 * sign anyone into the browser.
 */
export function authenticate(
  repos: AccountRepositories,
  secret: Buffer,
  production: boolean,
  /** PUBLIC_URL when configured: then the only origin a cookie write may come from. */
  publicOrigin?: string,
): RequestHandler {
  const withCredentials: RequestHandler = async (req, res, next) => {
    const header = req.get('authorization');
    if (header !== undefined) {
      const m = /^Bearer\s+(\S+)$/i.exec(header);
      if (!m || !m[1]!.startsWith(KEY_PREFIX)) {
        return next(
          new ProblemError(
            401,
            'Unauthorized',
            `Use an API key: Authorization: Bearer ${KEY_PREFIX}…`,
          ),
        );
      }
      const key = await repos.keys.byHash(hashApiKey(m[1]!));
      const nowIso = new Date().toISOString();
      const user = key ? await repos.users.byId(key.user_id) : undefined;
      if (
        !key ||
        key.revoked_at ||
        (key.expires_at && key.expires_at <= nowIso) ||
        !user ||
        user.status !== 'active'
      ) {
        return next(
          new ProblemError(401, 'Unauthorized', 'The API key is unknown, revoked or expired.'),
        );
      }
      req.principal = {
        kind: 'key',
        role: lower(key.role, user.role),
        userId: user.id,
        keyId: key.id,
      };
      if (!key.last_used_at || Date.now() - Date.parse(key.last_used_at) > KEY_TOUCH_MS) {
        await repos.keys.update(key.id, { last_used_at: nowIso });
      }
      return next();
    }
    const token = (req.cookies as Record<string, string> | undefined)?.[SESSION_COOKIE];
    if (!token) {
      req.principal = { kind: 'visitor', role: 'visitor' };
      return next();
    }
    const claims = verifySession(secret, token);
    const session = claims ? await repos.sessions.active(claims.jti) : undefined;
    const user = session ? await repos.users.byId(session.user_id) : undefined;
    if (
      !claims ||
      !session ||
      !user ||
      user.status !== 'active' ||
      String(user.id) !== claims.sub
    ) {
      res.clearCookie(SESSION_COOKIE, { path: '/' });
      req.principal = {
        kind: 'visitor',
        role: 'visitor',
        rejected: 'Your session is invalid or has ended: sign in again.',
      };
      return next();
    }
    // Cross-site writes: SameSite=Strict already withholds the cookie; check the Origin too.
    const refusal = crossSiteWriteRefusal({
      method: req.method,
      origin: req.get('origin'),
      secFetchSite: req.get('sec-fetch-site'),
      expected: [publicOrigin ?? `${req.protocol}://${req.get('host') ?? ''}`],
    });
    if (refusal) return next(new ProblemError(403, 'Forbidden', refusal));
    req.principal = { kind: 'session', role: user.role, userId: user.id, sessionId: session.id };
    if (Date.now() / 1000 - claims.iat > REFRESH_AFTER_SECONDS) {
      res.cookie(
        SESSION_COOKIE,
        signSession(secret, { sub: String(user.id), jti: session.id, role: user.role }),
        sessionCookieOptions(production),
      );
    }
    next();
  };
  return (req, res, next) => {
    // Most requests carry neither a key nor a cookie: they are answered without a promise.
    if (
      req.headers.authorization === undefined &&
      !(req.cookies as Record<string, string> | undefined)?.[SESSION_COOKIE]
    ) {
      req.principal = { kind: 'visitor', role: 'visitor' };
      return next();
    }
    return withCredentials(req, res, next);
  };
}
