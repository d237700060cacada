import { generateApiKey } from '../auth/api-keys';
import { roleRank, type Role } from '../auth/roles';
import type { KeyRow } from '../db/account-repositories';
import { ProblemError } from '../http/problem';
import { templates } from '../mail/templates';
import type { AccessContext } from './access-context';

/** Warn this long before a key expires. */
const NOTICE_DAYS = 7;

export interface KeyView {
  id: number;
  name: string;
  role: Role;
  prefix: string;
  createdAt: string;
  expiresAt: string | null;
  lastUsedAt: string | null;
  revokedAt: string | null;
  ownerId: number;
}

export const keyView = (k: KeyRow): KeyView => ({
  id: k.id,
  name: k.name,
  role: k.role,
  prefix: k.prefix,
  createdAt: k.created_at,
  expiresAt: k.expires_at,
  lastUsedAt: k.last_used_at,
  revokedAt: k.revoked_at,
  ownerId: k.user_id,
});

export function createKeyService(ctx: AccessContext) {
  const { repos } = ctx;
  const ownerOrAdmin = async (keyId: number, actor: { userId: number; role: Role }) => {
    const key = await repos.keys.byId(keyId);
    // Someone else's key answers exactly like a missing one (OWASP API1): no hint that it exists.
    if (!key || (key.user_id !== actor.userId && actor.role !== 'admin'))
      throw new ProblemError(404, 'Not found', `No API key ${keyId} of yours`);
    return key;
  };

  async function issue(
    owner: { id: number; email: string; name: string; role: Role },
    name: string,
    role: Role,
    expiresAt: string | null,
  ) {
    if (roleRank(role) > roleRank(owner.role)) {
      throw new ProblemError(
        403,
        'Forbidden',
        `A key's role may not exceed yours (${owner.role}).`,
        [{ path: '/body/role', message: 'higher than your own role' }],
      );
    }
    if (expiresAt !== null && Date.parse(expiresAt) <= Date.now()) {
      throw new ProblemError(400, 'Bad request', '/body/expiresAt: must lie in the future', [
        { path: '/body/expiresAt', message: 'must lie in the future' },
      ]);
    }
    const generated = generateApiKey();
    const id = await repos.keys.create({
      userId: owner.id,
      name,
      role,
      prefix: generated.prefix,
      hash: generated.hash,
      expiresAt,
    });
    await ctx.mailer.send(
      owner.email,
      templates.keyCreated(owner.name, name, generated.prefix, role),
    );
    return { ...keyView((await repos.keys.byId(id))!), key: generated.key };
  }

  return {
    async create(
      actor: { userId: number },
      input: { name: string; role: Role; expiresAt?: string },
      address?: string,
    ) {
      const owner = (await repos.users.byId(actor.userId))!;
      const created = await issue(owner, input.name.trim(), input.role, input.expiresAt ?? null);
      await repos.audit.record({
        actorUserId: owner.id,
        action: 'key.created',
        target: `key:${created.id}`,
        detail: { prefix: created.prefix, role: created.role },
        address,
      });
      return created;
    },
    list: async (userId: number) => (await repos.keys.ofUser(userId)).map(keyView),
    listAll: async () => (await repos.keys.all()).map(keyView),

    async revoke(keyId: number, actor: { userId: number; role: Role }, address?: string) {
      const key = await ownerOrAdmin(keyId, actor);
      if (!key.revoked_at)
        await repos.keys.update(key.id, { revoked_at: new Date().toISOString() });
      await repos.audit.record({
        actorUserId: actor.userId,
        action: 'key.revoked',
        target: `key:${key.id}`,
        detail: { prefix: key.prefix, owner: key.user_id },
        address,
      });
    },

    /** A new key with the same name and role; the old one keeps working for `overlapHours`. */
    async rotate(
      keyId: number,
      actor: { userId: number; role: Role },
      overlapHours: number,
      address?: string,
    ) {
      const old = await ownerOrAdmin(keyId, actor);
      if (old.revoked_at)
        throw new ProblemError(409, 'Conflict', 'This key is revoked; create a new one instead.');
      const owner = (await repos.users.byId(old.user_id))!;
      const created = await issue(owner, old.name, old.role, old.expires_at);
      const overlapEnd = new Date(Date.now() + overlapHours * 3600_000).toISOString();
      const expiresAt = old.expires_at && old.expires_at < overlapEnd ? old.expires_at : overlapEnd;
      await repos.keys.update(old.id, { expires_at: expiresAt, rotated_to: created.id });
      await repos.audit.record({
        actorUserId: actor.userId,
        action: 'key.rotated',
        target: `key:${old.id}`,
        detail: { newKey: created.id, oldKeyExpiresAt: expiresAt },
        address,
      });
      return { ...created, previousKeyExpiresAt: expiresAt };
    },

    /** Mails owners of keys that expire within a week, once per key. */
    async sendExpiryNotices(): Promise<number> {
      const before = new Date(Date.now() + NOTICE_DAYS * 86_400_000).toISOString();
      const keys = await repos.keys.expiringBefore(before);
      for (const k of keys) {
        const owner = await repos.users.byId(k.user_id);
        if (owner)
          await ctx.mailer.send(
            owner.email,
            templates.keyExpiring(owner.name, k.name, k.prefix, k.expires_at!),
          );
        await repos.keys.update(k.id, { expiry_notice_sent_at: new Date().toISOString() });
      }
      return keys.length;
    },
  };
}
export type KeyService = ReturnType<typeof createKeyService>;
