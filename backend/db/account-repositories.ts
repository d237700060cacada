import type { Knex } from 'knex';
import type { Role } from '../auth/roles';

/** Data access for people, sessions, one-time tokens, keys, usage and the audit log. */
export interface UserRow {
  id: number;
  email: string;
  name: string;
  password_hash: string;
  role: Role;
  status: 'active' | 'disabled';
  email_verified_at: string | null;
  created_at: string;
}

export interface KeyRow {
  id: number;
  user_id: number;
  name: string;
  role: Role;
  prefix: string;
  key_hash: string;
  created_at: string;
  expires_at: string | null;
  revoked_at: string | null;
  last_used_at: string | null;
  rotated_to: number | null;
  expiry_notice_sent_at: string | null;
}

const now = () => new Date().toISOString();

export function createAccountRepositories(knex: Knex) {
  const users = {
    byEmail: (email: string) =>
      knex<UserRow>('users').where({ email: email.toLowerCase() }).first(),
    byId: (id: number) => knex<UserRow>('users').where({ id }).first(),
    async create(u: {
      email: string;
      name: string;
      passwordHash: string;
      role: Role;
      verified: boolean;
    }): Promise<number> {
      const [row] = await knex('users')
        .insert({
          email: u.email.toLowerCase(),
          name: u.name,
          password_hash: u.passwordHash,
          role: u.role,
          status: 'active',
          email_verified_at: u.verified ? now() : null,
          created_at: now(),
        })
        .returning('id');
      return (row as { id: number }).id;
    },
    update: (id: number, patch: Partial<Omit<UserRow, 'id'>>) =>
      knex('users').where({ id }).update(patch),
    list: () => knex<UserRow>('users').orderBy('id'),
  };
  const sessions = {
    create: (id: string, userId: number, expiresAt: string) =>
      knex('sessions').insert({ id, user_id: userId, created_at: now(), expires_at: expiresAt }),
    active: (id: string) =>
      knex('sessions')
        .where({ id })
        .whereNull('revoked_at')
        .where('expires_at', '>', now())
        .first(),
    revoke: (id: string) =>
      knex('sessions').where({ id }).whereNull('revoked_at').update({ revoked_at: now() }),
    revokeAllFor: (userId: number) =>
      knex('sessions')
        .where({ user_id: userId })
        .whereNull('revoked_at')
        .update({ revoked_at: now() }),
  };
  const emailTokens = {
    create: (userId: number, purpose: 'verify' | 'reset', tokenHash: string, expiresAt: string) =>
      knex('email_tokens').insert({
        user_id: userId,
        purpose,
        token_hash: tokenHash,
        expires_at: expiresAt,
      }),
    /** Marks the token used and returns its user, once, if it is of that purpose and unexpired. */
    async consume(tokenHash: string, purpose: 'verify' | 'reset'): Promise<number | null> {
      return knex.transaction(async (trx) => {
        const row = await trx('email_tokens')
          .where({ token_hash: tokenHash, purpose })
          .whereNull('used_at')
          .where('expires_at', '>', now())
          .first();
        if (!row) return null;
        await trx('email_tokens').where({ id: row.id }).update({ used_at: now() });
        return row.user_id as number;
      });
    },
  };
  const keys = {
    async create(k: {
      userId: number;
      name: string;
      role: Role;
      prefix: string;
      hash: string;
      expiresAt: string | null;
    }): Promise<number> {
      const [row] = await knex('api_keys')
        .insert({
          user_id: k.userId,
          name: k.name,
          role: k.role,
          prefix: k.prefix,
          key_hash: k.hash,
          created_at: now(),
          expires_at: k.expiresAt,
        })
        .returning('id');
      return (row as { id: number }).id;
    },
    byHash: (hash: string) => knex<KeyRow>('api_keys').where({ key_hash: hash }).first(),
    byId: (id: number) => knex<KeyRow>('api_keys').where({ id }).first(),
    ofUser: (userId: number) => knex<KeyRow>('api_keys').where({ user_id: userId }).orderBy('id'),
    all: () => knex<KeyRow>('api_keys').orderBy('id'),
    update: (id: number, patch: Partial<Omit<KeyRow, 'id'>>) =>
      knex('api_keys').where({ id }).update(patch),
    revokeAllFor: (userId: number) =>
      knex('api_keys')
        .where({ user_id: userId })
        .whereNull('revoked_at')
        .update({ revoked_at: now() }),
    /** Live keys that expire before `before` and have not been warned about. */
    expiringBefore: (before: string) =>
      knex<KeyRow>('api_keys')
        .whereNull('revoked_at')
        .whereNull('expiry_notice_sent_at')
        .whereNotNull('expires_at')
        .where('expires_at', '<', before)
        .where('expires_at', '>', now()),
  };
  const usage = {
    // One upsert; the column is named with its table because PostgreSQL would read a bare
    // `count` in DO UPDATE as ambiguous (the row, or the proposed EXCLUDED row).
    increment: (keyId: number, day: string, group: string) =>
      knex('usage')
        .insert({ key_id: keyId, day, route_group: group, count: 1 })
        .onConflict(['key_id', 'day', 'route_group'])
        .merge({ count: knex.raw('?? + 1', ['usage.count']) }),
    ofUser: (userId: number, fromDay: string) =>
      knex('usage as u')
        .join('api_keys as k', 'k.id', 'u.key_id')
        .where('k.user_id', userId)
        .where('u.day', '>=', fromDay)
        .select(
          'u.key_id as keyId',
          'k.prefix',
          'k.name',
          'u.day',
          'u.route_group as routeGroup',
          'u.count',
        )
        .orderBy(['u.day', 'u.key_id']),
  };
  const audit = {
    record: (e: {
      actorUserId: number | null;
      action: string;
      target?: string | null;
      detail?: unknown;
      address?: string | null;
    }) =>
      knex('audit_log').insert({
        at: now(),
        actor_user_id: e.actorUserId,
        action: e.action,
        target: e.target ?? null,
        detail_json: e.detail === undefined ? null : JSON.stringify(e.detail),
        address: e.address ?? null,
      }),
    list: (limit: number) =>
      knex('audit_log as a')
        .leftJoin('users as u', 'u.id', 'a.actor_user_id')
        .select('a.*', 'u.email as actor_email')
        .orderBy('a.id', 'desc')
        .limit(limit),
  };
  const stacks = {
    get: (userId: number) => knex('user_stacks').where({ user_id: userId }).first(),
    put: (userId: number, json: string) =>
      knex('user_stacks')
        .insert({ user_id: userId, drafts_json: json, updated_at: now() })
        .onConflict('user_id')
        .merge(),
  };
  return { users, sessions, emailTokens, keys, usage, audit, stacks };
}

export type AccountRepositories = ReturnType<typeof createAccountRepositories>;
