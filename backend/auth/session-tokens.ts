import crypto from 'node:crypto';
import fs from 'node:fs';
import path from 'node:path';
import jwt from 'jsonwebtoken';

/** RFC 8725: pin the algorithm, check issuer and audience, keep access tokens short. */
export const JWT_ALGORITHM = 'HS256';
export const JWT_ISSUER = 'conductory';
export const JWT_AUDIENCE = 'conductory-web';
export const ACCESS_TOKEN_SECONDS = 15 * 60;
export const SESSION_COOKIE = 'conductory_session';

export interface SessionClaims {
  sub: string;
  jti: string;
  role: string;
}

/**
 * The signing secret: JWT_SECRET from the environment (≥ 32 bytes), or outside production one of
 * 256 random bits generated on first start and kept beside the database.
 */
export function loadJwtSecret(
  env: NodeJS.ProcessEnv,
  databaseFile: string,
  production: boolean,
): Buffer {
  if (env.JWT_SECRET) {
    const secret = Buffer.from(env.JWT_SECRET, 'utf8');
    if (secret.length < 32) throw new Error('JWT_SECRET must be at least 32 bytes');
    return secret;
  }
  if (production) throw new Error('JWT_SECRET must be set in production');
  if (databaseFile === ':memory:') return crypto.randomBytes(32);
  const file = path.join(path.dirname(path.resolve(databaseFile)), 'jwt-secret');
  if (!fs.existsSync(file))
    fs.writeFileSync(file, crypto.randomBytes(32).toString('base64'), { mode: 0o600 });
  return Buffer.from(fs.readFileSync(file, 'utf8'), 'base64');
}

export function signSession(secret: Buffer, claims: SessionClaims): string {
  return jwt.sign({ role: claims.role }, secret, {
    algorithm: JWT_ALGORITHM,
    issuer: JWT_ISSUER,
    audience: JWT_AUDIENCE,
    subject: claims.sub,
    jwtid: claims.jti,
    expiresIn: ACCESS_TOKEN_SECONDS,
  });
}

/** The claims of a valid token, or null for anything forged, expired, early or aimed elsewhere. */
export function verifySession(
  secret: Buffer,
  token: string,
): (SessionClaims & { iat: number }) | null {
  try {
    const payload = jwt.verify(token, secret, {
      algorithms: [JWT_ALGORITHM],
      issuer: JWT_ISSUER,
      audience: JWT_AUDIENCE,
    }) as jwt.JwtPayload;
    if (typeof payload.sub !== 'string' || typeof payload.jti !== 'string') return null;
    return {
      sub: payload.sub,
      jti: payload.jti,
      role: String(payload.role),
      iat: payload.iat ?? 0,
    };
  } catch {
    return null;
  }
}
