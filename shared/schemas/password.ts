import { commonPasswords } from './common-passwords';

/**
 * Why a password is refused, or null: 8–64 characters, at most 72 bytes (bcrypt ignores the
 * rest), and not among the commonest. Shared so the sign-up form says what the server will say.
 */
export function passwordProblem(password: string): string | null {
  if (password.length < 8) return 'use at least 8 characters';
  if (password.length > 64) return 'use at most 64 characters';
  if (new TextEncoder().encode(password).length > 72)
    return 'use at most 72 bytes (fewer accented or non-Latin characters)';
  if (commonPasswords.has(password.toLowerCase()))
    return 'this password is among the most common ones: choose another';
  return null;
}
