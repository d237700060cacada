import type { NextFunction, Request, RequestHandler, Response, Router } from 'express';
import type { ApiDocument } from '../api-document';
import { operationTable } from './resolve-operation';
import { ProblemError } from './problem';

/** A route's path in openapi.yaml's spelling: /keys/:id/rotate → /keys/{}/rotate. */
const expressShape = (path: string) => path.replace(/:[A-Za-z_]\w*/g, '{}');
const documentShape = (template: string) => template.replace(/\{[^}]+\}/g, '{}');

/** An Express route as the router keeps it: its path, methods and handlers' dispatcher. */
interface ExpressRoute {
  path: unknown;
  methods: object;
  dispatch(req: Request, res: Response, done: NextFunction): void;
}

/** Where an operation's request goes: the route, and which path segments are its parameters. */
interface Target {
  route: ExpressRoute;
  /** Each parameter's name in the route (`:id`) and its segment's index in the path. */
  params: Array<{ name: string; index: number }>;
}

/** The parameters of an Express path by position: /keys/:id/rotate → [{ name: 'id', index: 2 }]. */
function parameterPositions(path: string): Target['params'] {
  return path
    .split('/')
    .flatMap((segment, index) =>
      segment.startsWith(':') ? [{ name: segment.slice(1), index }] : [],
    );
}

/**
 * Hands each /api/v1 request to the one route that serves its operation. resolveOperation has
 * already named the operation (openapi.yaml's template and method) and checked its path, so
 * neither the routes nor their routers need be tried in turn (some fifty path matches for a late
 * route, issue 13's profile; then the router's own match of that route again). The parameters are
 * read from the path's segments as Express's router reads them.
 *
 * Checked at start-up, both ways: every operation of openapi.yaml has a route, and every route is
 * an operation of openapi.yaml (a route the document does not describe could never be reached,
 * since resolveOperation refuses it). Either mismatch stops the app before it listens.
 */
export function dispatchByOperation(routers: Router[], doc: ApiDocument): RequestHandler {
  const byShape = new Map<string, ExpressRoute>();
  for (const router of routers) {
    for (const layer of router.stack as Array<{ route?: ExpressRoute }>) {
      const route = layer.route;
      if (!route) continue;
      if (typeof route.path !== 'string')
        throw new Error(`A route's path must be a string to be matched to openapi.yaml`);
      for (const method of Object.keys(route.methods)) {
        const shape = `${method.toUpperCase()} ${expressShape(route.path)}`;
        // As in Express, the first route declared for a path and method serves it.
        if (!byShape.has(shape)) byShape.set(shape, route);
      }
    }
  }
  const byOperation = new Map<string, Target>();
  for (const table of operationTable(doc)) {
    for (const op of table.operations.values()) {
      const shape = `${op.method} ${documentShape(op.template)}`;
      const route = byShape.get(shape);
      if (!route) throw new Error(`openapi.yaml: ${op.id} has no route in the app`);
      byOperation.set(op.id, { route, params: parameterPositions(route.path as string) });
      byShape.delete(shape);
    }
  }
  const undocumented = [...byShape.keys()];
  if (undocumented.length)
    throw new Error(`Routes missing from openapi.yaml: ${undocumented.join(', ')}`);
  const dispatch: RequestHandler = (req, res, next) => {
    const target = req.operation && byOperation.get(req.operation.id);
    // resolveOperation answers unknown paths first; should one reach here, nothing is waved through.
    if (!target) return next(new ProblemError(404, 'Not found', `No API resource at ${req.path}`));
    // The parameters as Express's router would set them: each segment decoded. resolveOperation
    // has already refused a segment that does not decode or is not one clean segment.
    const params: Record<string, string> = {};
    if (target.params.length > 0) {
      const segments = req.path.split('/');
      for (const { name, index } of target.params)
        params[name] = decodeURIComponent(segments[index]!);
    }
    req.params = params;
    target.route.dispatch(req, res, next);
  };
  // The routers' layers, for whoever walks the app's routes as Express exposes them (the API
  // inventory test, OWASP API9).
  return Object.assign(dispatch, { stack: routers.flatMap((r) => r.stack as unknown[]) });
}
