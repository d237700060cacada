import crypto from 'node:crypto';
import { hashToken, randomToken } from '../auth/api-keys';
import { DUMMY_HASH, hashPassword, passwordProblem, verifyPassword } from '../auth/passwords';
import type { Role } from '../auth/roles';
import { ACCESS_TOKEN_SECONDS, signSession } from '../auth/session-tokens';
import { ProblemError } from '../http/problem';
import { templates } from '../mail/templates';
import type { AccessContext } from './access-context';

const HOUR = 3600_000;
const SESSION_HOURS = 12;
const inHours = (h: number) => new Date(Date.now() + h * HOUR).toISOString();
const badField = (path: string, message: string) =>
  new ProblemError(400, 'Bad request', `${path}: ${message}`, [{ path, message }]);

export interface PublicUser {
  id: number;
  email: string;
  name: string;
  role: Role;
  emailVerified: boolean;
}

export function publicUser(u: {
  id: number;
  email: string;
  name: string;
  role: Role;
  email_verified_at: string | null;
}): PublicUser {
  return {
    id: u.id,
    email: u.email,
    name: u.name,
    role: u.role,
    emailVerified: u.email_verified_at !== null,
  };
}

/** Sign-up, e-mail verification, sign-in and out, password reset. */
export function createAccountService(ctx: AccessContext) {
  const { repos } = ctx;

  async function sendVerification(userId: number, email: string, name: string) {
    const token = randomToken();
    await repos.emailTokens.create(userId, 'verify', hashToken(token), inHours(24));
    await ctx.mailer.send(
      email,
      templates.verification(name, `${ctx.publicUrl()}/verify?token=${token}`),
    );
  }

  return {
    /** The same answer whether or not the address is taken; only a new account gets a mail. */
    async signUp(
      input: { email: string; password: string; name: string },
      address: string | undefined,
    ) {
      const problem = passwordProblem(input.password);
      if (problem) throw badField('/body/password', problem);
      const existing = await repos.users.byEmail(input.email);
      if (existing) {
        await repos.audit.record({
          actorUserId: null,
          action: 'sign-up.duplicate',
          target: input.email.toLowerCase(),
          address,
        });
        return;
      }
      const id = await repos.users.create({
        email: input.email,
        name: input.name.trim(),
        passwordHash: await hashPassword(input.password),
        role: 'reader',
        verified: false,
      });
      await repos.audit.record({
        actorUserId: id,
        action: 'sign-up',
        target: input.email.toLowerCase(),
        address,
      });
      await sendVerification(id, input.email, input.name.trim());
    },

    async verify(token: string, address: string | undefined) {
      const userId = await repos.emailTokens.consume(hashToken(token), 'verify');
      if (userId === null)
        throw badField(
          '/body/token',
          'this link is unknown, used or expired: sign up again or ask for a new one',
        );
      await repos.users.update(userId, { email_verified_at: new Date().toISOString() });
      await repos.audit.record({ actorUserId: userId, action: 'email.verified', address });
    },

    /** A session cookie value for a right password; one vague answer for every wrong case. */
    async signIn(
      input: { email: string; password: string },
      address: string | undefined,
    ): Promise<{ token: string; user: PublicUser }> {
      const user = await repos.users.byEmail(input.email);
      const ok = await verifyPassword(input.password, user?.password_hash ?? DUMMY_HASH);
      if (!user || !ok || user.status !== 'active') {
        await repos.audit.record({
          actorUserId: user?.id ?? null,
          action: 'sign-in.failed',
          target: input.email.toLowerCase(),
          address,
        });
        throw new ProblemError(401, 'Unauthorized', 'The e-mail address or the password is wrong.');
      }
      if (!user.email_verified_at)
        throw new ProblemError(
          403,
          'Forbidden',
          'Confirm your e-mail address first: follow the link we sent.',
        );
      const sessionId = crypto.randomUUID();
      await repos.sessions.create(sessionId, user.id, inHours(SESSION_HOURS));
      await repos.audit.record({ actorUserId: user.id, action: 'sign-in', address });
      return {
        token: signSession(ctx.secret, { sub: String(user.id), jti: sessionId, role: user.role }),
        user: publicUser(user),
      };
    },

    async signOut(sessionId: string, userId: number, address: string | undefined) {
      await repos.sessions.revoke(sessionId);
      await repos.audit.record({ actorUserId: userId, action: 'sign-out', address });
    },

    /** The same answer whether or not the account exists. */
    async requestReset(email: string, address: string | undefined) {
      const user = await repos.users.byEmail(email);
      await repos.audit.record({
        actorUserId: user?.id ?? null,
        action: 'password.reset-requested',
        target: email.toLowerCase(),
        address,
      });
      if (!user || user.status !== 'active') return;
      const token = randomToken();
      await repos.emailTokens.create(user.id, 'reset', hashToken(token), inHours(1));
      await ctx.mailer.send(
        user.email,
        templates.reset(user.name, `${ctx.publicUrl()}/reset?token=${token}`),
      );
    },

    async reset(token: string, password: string, address: string | undefined) {
      const problem = passwordProblem(password);
      if (problem) throw badField('/body/password', problem);
      const userId = await repos.emailTokens.consume(hashToken(token), 'reset');
      if (userId === null)
        throw badField('/body/token', 'this link is unknown, used or expired: ask for a new one');
      await repos.users.update(userId, {
        password_hash: await hashPassword(password),
        email_verified_at: new Date().toISOString(),
      });
      await repos.sessions.revokeAllFor(userId);
      await repos.audit.record({ actorUserId: userId, action: 'password.reset', address });
    },

    sessionMaxAgeSeconds: ACCESS_TOKEN_SECONDS,
  };
}
export type AccountService = ReturnType<typeof createAccountService>;
