import type { Express } from 'express';
import type { Knex } from 'knex';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { loadApiDocument } from '../../../backend/api-document';
import { createTestApp } from '../../helpers/test-app';

let app: Express;
let knex: Knex;
beforeAll(async () => ({ app, knex } = await createTestApp()));
afterAll(() => knex.destroy());

interface Layer {
  route?: { path: string; methods: Record<string, boolean> };
  handle?: { stack?: Layer[] };
}

/** Every method + path that a route layer answers, found by walking the router tree. */
function mountedRoutes(stack: Layer[]): string[] {
  return stack.flatMap((layer) => {
    if (layer.route) {
      return Object.keys(layer.route.methods).map((m) => `${m.toUpperCase()} ${layer.route!.path}`);
    }
    return layer.handle?.stack ? mountedRoutes(layer.handle.stack) : [];
  });
}

// Routes outside /api/v1 that are not API operations: the document itself, the reference page's
// header script and the front end.
// The reference page's script is GET /header.js in the router mounted at /api/docs (layers do not
// carry their mount path).
const NOT_OPERATIONS = ['GET /api/openapi.json', 'GET /header.js', 'GET /{*splat}'];

describe('API inventory (OWASP API9): openapi.yaml and the mounted routes agree', () => {
  const documented = Object.entries(loadApiDocument().paths).flatMap(([path, ops]) =>
    Object.keys(ops).map((m) => `${m.toUpperCase()} ${path.replace(/\{(\w+)\}/g, ':$1')}`),
  );

  it('mounts every operation in openapi.yaml', () => {
    const mounted = mountedRoutes((app as unknown as { router: { stack: Layer[] } }).router.stack);
    for (const op of documented) expect(mounted, op).toContain(op);
  });

  it('documents every mounted route', () => {
    const mounted = mountedRoutes((app as unknown as { router: { stack: Layer[] } }).router.stack);
    for (const route of mounted) {
      if (NOT_OPERATIONS.includes(route)) continue;
      expect(documented, route).toContain(route);
    }
  });
});

describe('every operation states who may call it (x-roles)', () => {
  it('has x-roles on every operation, with known roles only', () => {
    const known = ['visitor', 'reader', 'integrator', 'curator', 'admin'];
    for (const [path, ops] of Object.entries(loadApiDocument().paths)) {
      for (const [method, op] of Object.entries(ops)) {
        const roles = (op as { 'x-roles'?: string[] })['x-roles'];
        expect(roles, `${method} ${path}`).toBeDefined();
        for (const r of roles!) expect(known).toContain(r);
      }
    }
  });
});
