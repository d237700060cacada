import { Router, type Request } from 'express';
import type { AccountRepositories } from '../db/account-repositories';
import { ProblemError } from '../http/problem';
import type { KeyService } from '../services/keys';

/** Keys manage machines' access; only a person signed in through the browser may manage them. */
function person(req: Request) {
  const p = req.principal;
  if (p.kind !== 'session')
    throw new ProblemError(
      403,
      'Forbidden',
      'API keys are managed from a signed-in session, not with a key.',
    );
  return { userId: p.userId, role: p.role };
}

export function keysRouter(keys: KeyService, repos: AccountRepositories): Router {
  const router = Router({ caseSensitive: true, strict: true });

  router.get('/keys', async (req, res) => {
    res.json({ items: await keys.list(person(req).userId) });
  });

  router.post('/keys', async (req, res) => {
    const actor = person(req);
    res.status(201).json(await keys.create(actor, req.body, req.ip));
  });

  router.delete('/keys/:id', async (req, res) => {
    await keys.revoke(Number(req.params.id), person(req), req.ip);
    res.status(204).end();
  });

  router.post('/keys/:id/rotate', async (req, res) => {
    const overlapHours = Number(
      (req.body as { overlapHours?: number } | undefined)?.overlapHours ?? 24,
    );
    res
      .status(201)
      .json(await keys.rotate(Number(req.params.id), person(req), overlapHours, req.ip));
  });

  router.get('/usage', async (req, res) => {
    const p = req.principal as { userId: number };
    // openapi.yaml's rule again (integer 1..366): the validator coerces 'Infinity' to a number,
    // and a date that far back is an invalid time value.
    const days = Number(req.query.days ?? 30);
    if (!Number.isInteger(days) || days < 1 || days > 366)
      throw new ProblemError(400, 'Bad request', '/query/days: must be an integer from 1 to 366', [
        { path: '/query/days', message: 'must be an integer from 1 to 366' },
      ]);
    const from = new Date(Date.now() - (days - 1) * 86_400_000).toISOString().slice(0, 10);
    res.json({ from, items: await repos.usage.ofUser(p.userId, from) });
  });

  return router;
}
