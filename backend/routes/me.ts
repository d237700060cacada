import { Router } from 'express';
import type { AccountRepositories } from '../db/account-repositories';
import { ProblemError } from '../http/problem';
import { publicUser } from '../services/accounts';

/** The signed-in person, and the stacks they keep on their account. */
export function meRouter(repos: AccountRepositories): Router {
  const router = Router({ caseSensitive: true, strict: true });
  const userId = (req: { principal: { kind: string; userId?: number } }) => req.principal.userId!;

  router.get('/me', async (req, res) => {
    const user = await repos.users.byId(userId(req));
    if (!user) throw new ProblemError(401, 'Unauthorized', 'Sign in again.');
    res.json(publicUser(user));
  });

  router.get('/me/stacks', async (req, res) => {
    const row = await repos.stacks.get(userId(req));
    res.json({
      drafts: row ? JSON.parse(row.drafts_json) : [],
      updatedAt: row?.updated_at ?? null,
    });
  });

  router.put('/me/stacks', async (req, res) => {
    await repos.stacks.put(userId(req), JSON.stringify(req.body.drafts));
    const row = await repos.stacks.get(userId(req));
    res.json({ drafts: JSON.parse(row.drafts_json), updatedAt: row.updated_at });
  });

  return router;
}
