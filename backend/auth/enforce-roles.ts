import type { RequestHandler } from 'express';
import { ProblemError } from '../http/problem';

/**
 * The one place access is decided: the resolved operation's x-roles (openapi.yaml) against the
 * caller's role. It runs before request validation, so a caller without access learns nothing
 * about the body's rules. A request with no resolved operation is refused: resolveOperation
 * should already have answered it, and if it did not, nothing is waved through.
 */
export function enforceRoles(): RequestHandler {
  return (req, _res, next) => {
    const op = req.operation;
    if (!op) return next(new ProblemError(404, 'Not found', `No API resource at ${req.path}`));
    const p = req.principal;
    if (op.roles.includes(p.role)) return next();
    if (p.kind === 'visitor') {
      return next(
        new ProblemError(
          401,
          'Unauthorized',
          p.rejected ?? 'Sign in, or send an API key, to use this operation.',
        ),
      );
    }
    next(
      new ProblemError(
        403,
        'Forbidden',
        `The ${p.role} role may not use ${op.method} /api/v1${op.template}.`,
      ),
    );
  };
}
