import bcrypt from 'bcryptjs';
import { commonPasswords } from './common-passwords';

/** bcrypt work factor: ≥ 10 per quality.md; 11 costs about 150 ms here. */
export const BCRYPT_COST = 11;

/** Why a password is refused, or null. Length 8–64 and ≤ 72 bytes (bcrypt ignores the rest). */
export function passwordProblem(password: string): string | null {
  if (password.length < 8) return 'use at least 8 characters';
  if (password.length > 64) return 'use at most 64 characters';
  if (new TextEncoder().encode(password).length > 72)
    return 'use at most 72 bytes (fewer accented or non-Latin characters)';
  if (commonPasswords.has(password.toLowerCase()))
    return 'this password is among the most common ones: choose another';
  return null;
}

/**
 * bcrypt blocks its thread for ~150 ms per hash; at most two run at once so that a burst of
 * sign-ins cannot starve every other request.
 */
let running = 0;
const waiting: Array<() => void> = [];
async function limited<T>(work: () => Promise<T>): Promise<T> {
  if (running >= 2) await new Promise<void>((resolve) => waiting.push(resolve));
  running++;
  try {
    return await work();
  } finally {
    running--;
    waiting.shift()?.();
  }
}

export function hashPassword(password: string): Promise<string> {
  return limited(() => bcrypt.hash(password, BCRYPT_COST));
}

export function verifyPassword(password: string, hash: string): Promise<boolean> {
  return limited(() => bcrypt.compare(password, hash));
}

/** A hash of a password nobody has, compared against when the account does not exist, so both answers take as long. */
export const DUMMY_HASH = bcrypt.hashSync('no such account, only for timing', BCRYPT_COST);
