import bcrypt from 'bcryptjs';
export { passwordProblem } from '../../shared/schemas/password';

/** bcrypt work factor: ≥ 10 per quality.md; 11 costs about 150 ms here. */
export const BCRYPT_COST = 11;

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
