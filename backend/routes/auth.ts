import { Router, type RequestHandler } from 'express';
import { sessionCookieOptions } from '../auth/authenticate';
import { SESSION_COOKIE } from '../auth/session-tokens';
import type { AccountService } from '../services/accounts';

export function authRouter(
  accounts: AccountService,
  throttles: RequestHandler[],
  production: boolean,
): Router {
  const router = Router({ caseSensitive: true, strict: true });

  router.post('/auth/sign-up', ...throttles, async (req, res) => {
    await accounts.signUp(req.body, req.ip);
    res.status(202).json({
      status: 'check-your-mail',
      detail: 'If this address can sign up, a confirmation link is on its way.',
    });
  });

  router.post('/auth/verify', async (req, res) => {
    await accounts.verify(String(req.body.token), req.ip);
    res.json({ status: 'verified' });
  });

  router.post('/auth/sign-in', ...throttles, async (req, res) => {
    const { token, user } = await accounts.signIn(req.body, req.ip);
    res.cookie(SESSION_COOKIE, token, sessionCookieOptions(production)).json({ user });
  });

  router.post('/auth/sign-out', async (req, res) => {
    const p = req.principal;
    if (p.kind === 'session') await accounts.signOut(p.sessionId, p.userId, req.ip);
    res.clearCookie(SESSION_COOKIE, { path: '/' }).status(204).end();
  });

  router.post('/auth/reset-request', ...throttles, async (req, res) => {
    await accounts.requestReset(String(req.body.email), req.ip);
    res.status(202).json({
      status: 'check-your-mail',
      detail: 'If an account has this address, a reset link is on its way.',
    });
  });

  router.post('/auth/reset', async (req, res) => {
    await accounts.reset(String(req.body.token), String(req.body.password), req.ip);
    res.json({ status: 'password-changed' });
  });

  return router;
}
