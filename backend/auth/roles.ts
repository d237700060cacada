/** Roles in order of reach; a key's role may not exceed its owner's. */
export const roles = ['reader', 'integrator', 'curator', 'admin'] as const;
export type Role = (typeof roles)[number];
export type Caller = Role | 'visitor';

export function roleRank(role: Caller): number {
  return role === 'visitor' ? 0 : roles.indexOf(role) + 1;
}

export function isRole(value: unknown): value is Role {
  return typeof value === 'string' && (roles as readonly string[]).includes(value);
}
