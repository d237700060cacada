import { Router } from 'express';
import type { AccountRepositories } from '../db/account-repositories';
import { ProblemError } from '../http/problem';
import { maskMail } from '../mail/mask';
import type { OutboxRepository } from '../mail/outbox-repository';
import { publicUser } from '../services/accounts';
import type { KeyService } from '../services/keys';

/** The operator's views: people, every key, the audit log and the mail outbox. */
export function adminRouter(
  repos: AccountRepositories,
  keys: KeyService,
  outbox: OutboxRepository,
): Router {
  const router = Router({ caseSensitive: true, strict: true });

  router.get('/users', async (_req, res) => {
    const users = await repos.users.list();
    res.json({
      items: users.map((u) => ({ ...publicUser(u), status: u.status, createdAt: u.created_at })),
    });
  });

  router.patch('/users/:id', async (req, res) => {
    const id = Number(req.params.id);
    const actor = req.principal as { userId: number };
    const user = await repos.users.byId(id);
    if (!user) throw new ProblemError(404, 'Not found', `No user ${id}`);
    const { role, status } = req.body as { role?: typeof user.role; status?: typeof user.status };
    if (id === actor.userId && ((role && role !== 'admin') || status === 'disabled')) {
      throw new ProblemError(
        409,
        'Conflict',
        'An admin cannot demote or disable themselves: ask another admin.',
      );
    }
    if (role && role !== user.role) {
      await repos.users.update(id, { role });
      // A role change ends every session, so no token carries the old role (quality.md).
      await repos.sessions.revokeAllFor(id);
      await repos.audit.record({
        actorUserId: actor.userId,
        action: 'user.role-changed',
        target: `user:${id}`,
        detail: { from: user.role, to: role },
        address: req.ip,
      });
    }
    if (status && status !== user.status) {
      await repos.users.update(id, { status });
      if (status === 'disabled') {
        await repos.sessions.revokeAllFor(id);
        await repos.keys.revokeAllFor(id);
      }
      await repos.audit.record({
        actorUserId: actor.userId,
        action: `user.${status === 'disabled' ? 'disabled' : 'enabled'}`,
        target: `user:${id}`,
        address: req.ip,
      });
    }
    const updated = (await repos.users.byId(id))!;
    res.json({ ...publicUser(updated), status: updated.status, createdAt: updated.created_at });
  });

  router.get('/admin/keys', async (_req, res) => {
    res.json({ items: await keys.listAll() });
  });

  router.get('/audit', async (req, res) => {
    // openapi.yaml's rule again (integer 1..1000): the validator coerces 'Infinity' to a number,
    // and Knex drops a limit that is not an integer, which listed the whole log.
    const limit = Number(req.query.limit ?? 200);
    if (!Number.isInteger(limit) || limit < 1 || limit > 1000)
      throw new ProblemError(
        400,
        'Bad request',
        '/query/limit: must be an integer from 1 to 1000',
        [{ path: '/query/limit', message: 'must be an integer from 1 to 1000' }],
      );
    const rows = await repos.audit.list(limit);
    res.json({
      items: rows.map((r: Record<string, unknown>) => ({
        id: r.id,
        at: r.at,
        actor: r.actor_email ?? null,
        action: r.action,
        target: r.target ?? null,
        detail: r.detail_json ? JSON.parse(String(r.detail_json)) : null,
        address: r.address ?? null,
      })),
    });
  });

  router.get('/admin/outbox', async (req, res) => {
    const to = typeof req.query.to === 'string' ? req.query.to : undefined;
    // The mailer files them masked; masked again here for messages an older version filed.
    const items = await outbox.list(Number(req.query.limit ?? 100), to);
    res.json({ items: items.map(maskMail) });
  });

  return router;
}
