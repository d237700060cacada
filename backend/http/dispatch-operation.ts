import type { RequestHandler, Router } from 'express';
import type { ApiDocument } from '../api-document';
import { operationTable } from './resolve-operation';
import { ProblemError } from './problem';

/** A route's path in openapi.yaml's spelling: /keys/:id/rotate → /keys/{}/rotate. */
const expressShape = (path: string) => path.replace(/:[A-Za-z_]\w*/g, '{}');
const documentShape = (template: string) => template.replace(/\{[^}]+\}/g, '{}');

/**
 * Hands each /api/v1 request to the one router that serves its operation. resolveOperation has
 * already named the operation (openapi.yaml's template and method), so the routers need not be
 * tried one route after another (some fifty path matches for a late route, issue 13's profile);
 * the router found still matches its own route and reads its parameters as Express does.
 *
 * Checked at start-up, both ways: every operation of openapi.yaml has a route, and every route is
 * an operation of openapi.yaml (a route the document does not describe could never be reached,
 * since resolveOperation refuses it). Either mismatch stops the app before it listens.
 */
export function dispatchByOperation(routers: Router[], doc: ApiDocument): RequestHandler {
  const byShape = new Map<string, Router>();
  for (const router of routers) {
    for (const layer of router.stack as Array<{ route?: { path: unknown; methods: object } }>) {
      if (!layer.route) continue;
      if (typeof layer.route.path !== 'string')
        throw new Error(`A route's path must be a string to be matched to openapi.yaml`);
      for (const method of Object.keys(layer.route.methods)) {
        const shape = `${method.toUpperCase()} ${expressShape(layer.route.path)}`;
        // As in Express, the first router to declare a route serves it.
        if (!byShape.has(shape)) byShape.set(shape, router);
      }
    }
  }
  const byOperation = new Map<string, Router>();
  for (const route of operationTable(doc)) {
    for (const op of route.operations.values()) {
      const shape = `${op.method} ${documentShape(op.template)}`;
      const router = byShape.get(shape);
      if (!router) throw new Error(`openapi.yaml: ${op.id} has no route in the app`);
      byOperation.set(op.id, router);
      byShape.delete(shape);
    }
  }
  const undocumented = [...byShape.keys()];
  if (undocumented.length)
    throw new Error(`Routes missing from openapi.yaml: ${undocumented.join(', ')}`);
  const dispatch: RequestHandler = (req, res, next) => {
    const router = req.operation && byOperation.get(req.operation.id);
    // resolveOperation answers unknown paths first; should one reach here, nothing is waved through.
    if (!router) return next(new ProblemError(404, 'Not found', `No API resource at ${req.path}`));
    router(req, res, next);
  };
  // The routers' layers, for whoever walks the app's routes as Express exposes them (the API
  // inventory test, OWASP API9).
  return Object.assign(dispatch, { stack: routers.flatMap((r) => r.stack as unknown[]) });
}
