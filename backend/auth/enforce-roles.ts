import type { RequestHandler } from 'express';
import type { ApiDocument } from '../api-document';
import { ProblemError } from '../http/problem';
import type { Caller } from './roles';

interface RouteRule {
  method: string;
  pattern: RegExp;
  roles: Caller[];
}

/** Every operation's x-roles from openapi.yaml, as method + path pattern under /api/v1. */
export function roleRules(doc: ApiDocument): RouteRule[] {
  const rules: RouteRule[] = [];
  for (const [path, ops] of Object.entries(doc.paths)) {
    // Literal segments before parameter ones, so /keys/mine would win over /keys/{id}.
    const pattern = new RegExp(`^/api/v1${path.replace(/\{[^}]+\}/g, '[^/]+')}/?$`);
    for (const [method, op] of Object.entries(ops)) {
      const roles = (op as { 'x-roles'?: Caller[] })['x-roles'];
      if (!roles) throw new Error(`openapi.yaml: ${method.toUpperCase()} ${path} has no x-roles`);
      rules.push({ method: method.toUpperCase(), pattern, roles });
    }
  }
  return rules.sort((a, b) =>
    a.pattern.source.includes('[^/]+') ? 1 : b.pattern.source.includes('[^/]+') ? -1 : 0,
  );
}

/**
 * The one place access is decided: the operation's x-roles in openapi.yaml against the caller's
 * role. It runs before request validation, so a caller without access learns nothing about the
 * body's rules. Paths the document does not know fall through to the validator's 404.
 */
export function enforceRoles(doc: ApiDocument): RequestHandler {
  const rules = roleRules(doc);
  // Paths repeat (the same few searches and calculators): remember each one's rule.
  const seen = new Map<string, RouteRule | null>();
  return (req, _res, next) => {
    const path = req.originalUrl.split('?')[0]!;
    const key = `${req.method} ${path}`;
    let rule = seen.get(key);
    if (rule === undefined) {
      rule = rules.find((r) => r.method === req.method && r.pattern.test(path)) ?? null;
      if (seen.size > 10_000) seen.clear();
      seen.set(key, rule);
    }
    if (!rule) return next();
    const p = req.principal;
    if (rule.roles.includes(p.role)) return next();
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
      new ProblemError(403, 'Forbidden', `The ${p.role} role may not use ${req.method} ${path}.`),
    );
  };
}
