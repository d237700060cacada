import type { RequestHandler } from 'express';
import type { ApiDocument } from '../api-document';
import type { Caller } from '../auth/roles';
import { ProblemError } from './problem';

/** The operation of openapi.yaml that a request resolved to, and who may call it. */
export interface ResolvedOperation {
  /** `METHOD /template`, e.g. `POST /keys/{id}/rotate`: one per operation of openapi.yaml. */
  id: string;
  method: string;
  /** The path as written in openapi.yaml, e.g. /keys/{id}/rotate. */
  template: string;
  roles: Caller[];
  tags: string[];
  /** x-heavy: counted by the calculations' rate limit like an estimate (a batch, a plan). */
  heavy: boolean;
}

declare module 'express-serve-static-core' {
  interface Request {
    operation?: ResolvedOperation;
  }
}

export const API_PREFIX = '/api/v1';
const METHODS = ['get', 'put', 'post', 'delete', 'patch', 'head', 'options', 'trace'];

interface Route {
  segments: Array<{ literal: string } | { param: string }>;
  operations: Map<string, ResolvedOperation>;
}

/** A parameter segment's text, decoded, or null when it is not one clean segment. */
function parameterValue(raw: string): string | null {
  let value: string;
  try {
    value = decodeURIComponent(raw);
  } catch {
    return null;
  }
  if (value === '' || value === '.' || value === '..' || value.includes('/')) return null;
  return value;
}

/**
 * Builds the lookup from openapi.yaml. Each path is split into literal and {parameter} segments;
 * every operation must say who may call it (x-roles), or the app refuses to start.
 */
export function operationTable(doc: ApiDocument): Route[] {
  return Object.entries(doc.paths).map(([template, item]) => {
    const operations = new Map<string, ResolvedOperation>();
    for (const [method, op] of Object.entries(item)) {
      if (!METHODS.includes(method)) continue;
      const o = op as { 'x-roles'?: Caller[]; tags?: string[]; 'x-heavy'?: boolean };
      if (!o['x-roles'])
        throw new Error(`openapi.yaml: ${method.toUpperCase()} ${template} has no x-roles`);
      operations.set(method.toUpperCase(), {
        id: `${method.toUpperCase()} ${template}`,
        method: method.toUpperCase(),
        template,
        roles: o['x-roles'],
        tags: o.tags ?? [],
        heavy: o['x-heavy'] === true,
      });
    }
    const segments = template
      .split('/')
      .slice(1)
      .map((s) => (/^\{[^}]+\}$/.test(s) ? { param: s.slice(1, -1) } : { literal: s }));
    return { segments, operations };
  });
}

/**
 * Finds the one route a raw path (as sent, not decoded) belongs to. Literal segments must match
 * exactly, case and all; so `/USERS`, `/%75sers`, `/users/`, `//users` and `/keys/../users`
 * belong to nothing. Where a literal and a parameter both fit (/alloys/export, /alloys/{slug}),
 * the literal wins, segment by segment from the left.
 */
export function findRoute(routes: Route[], rawPath: string): Route | undefined {
  const parts = rawPath.split('/').slice(1);
  let best: { route: Route; rank: string } | undefined;
  for (const route of routes) {
    if (route.segments.length !== parts.length) continue;
    let rank = '';
    let fits = true;
    for (let i = 0; i < parts.length && fits; i++) {
      const seg = route.segments[i]!;
      if ('literal' in seg) {
        fits = parts[i] === seg.literal;
        rank += '0';
      } else {
        fits = parameterValue(parts[i]!) !== null;
        rank += '1';
      }
    }
    if (fits && (!best || rank < best.rank)) best = { route, rank };
  }
  return best?.route;
}

/**
 * Deny by default: every request under /api/v1 resolves to exactly one operation of
 * openapi.yaml before anything else runs, or ends here as a 404 (unknown path) or 405 (known
 * path, other method). The role check then reads the resolved operation, never a second list.
 * Any other spelling of /api (case, percent-encoding) is a 404 too, so nothing under it can fall
 * through to the front end's catch-all.
 */
export function resolveOperation(doc: ApiDocument): RequestHandler {
  const routes = operationTable(doc);
  return (req, res, next) => {
    const rawPath = req.path;
    if (!rawPath.startsWith(`${API_PREFIX}/`)) {
      let decoded = rawPath;
      try {
        decoded = decodeURIComponent(rawPath);
      } catch {
        // Malformed escapes: judged on the raw text below.
      }
      const lower = decoded.toLowerCase().replace(/\/{2,}/g, '/');
      const isApi = lower === '/api' || lower.startsWith('/api/');
      const isDocs =
        rawPath === '/api/openapi.json' ||
        rawPath === '/api/docs' ||
        rawPath.startsWith('/api/docs/');
      if (isApi && !isDocs)
        return next(new ProblemError(404, 'Not found', `No API resource at ${rawPath}`));
      return next();
    }
    const route = findRoute(routes, rawPath.slice(API_PREFIX.length));
    if (!route) return next(new ProblemError(404, 'Not found', `No API resource at ${rawPath}`));
    // Only what openapi.yaml declares: HEAD and OPTIONS are 405 like any other method it lacks.
    const operation = route.operations.get(req.method);
    if (!operation) {
      res.set('Allow', [...route.operations.keys()].join(', '));
      return next(
        new ProblemError(405, 'Method not allowed', `${req.method} is not allowed on ${rawPath}`),
      );
    }
    req.operation = operation;
    next();
  };
}
