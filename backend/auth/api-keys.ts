import crypto from 'node:crypto';

/** Keys look like cdy_<8-character prefix>_<43 characters>: 256 random bits, the prefix shown to tell them apart. */
export const KEY_PREFIX = 'cdy_';

export function generateApiKey(): { key: string; prefix: string; hash: string } {
  const prefix = crypto.randomBytes(6).toString('base64url').slice(0, 8);
  const secret = crypto.randomBytes(32).toString('base64url');
  const key = `${KEY_PREFIX}${prefix}_${secret}`;
  return { key, prefix, hash: hashApiKey(key) };
}

/** SHA-256 of the whole key: a database dump holds nothing that authenticates. */
export function hashApiKey(key: string): string {
  return crypto.createHash('sha256').update(key, 'utf8').digest('hex');
}

export function hashToken(token: string): string {
  return crypto.createHash('sha256').update(token, 'utf8').digest('hex');
}

export function randomToken(): string {
  return crypto.randomBytes(32).toString('base64url');
}
