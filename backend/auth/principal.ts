import type { Caller, Role } from './roles';

/** Who is calling: a visitor, a person signed in through the browser, or a machine with a key. */
export type Principal =
  | { kind: 'visitor'; role: 'visitor'; rejected?: string }
  | { kind: 'session'; role: Role; userId: number; sessionId: string }
  | { kind: 'key'; role: Role; userId: number; keyId: number };

declare module 'express-serve-static-core' {
  interface Request {
    principal: Principal;
  }
}

export const callerRole = (p: Principal): Caller => p.role;
