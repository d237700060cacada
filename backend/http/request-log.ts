import type { IncomingMessage, ServerResponse } from 'node:http';
import type { RequestHandler } from 'express';
import type { DestinationStream } from 'pino';
import { pinoHttp } from 'pino-http';

/**
 * Header paths that hold credentials. The request log writes no headers at all, but an error
 * logged with its request (or a future field) must not carry them either: pino's redact is the
 * second lock on the same door.
 */
export const SECRET_PATHS = [
  'req.headers.cookie',
  'req.headers.authorization',
  'req.headers["x-api-key"]',
  'res.headers["set-cookie"]',
  'headers.cookie',
  'headers.authorization',
  'headers["x-api-key"]',
  'headers["set-cookie"]',
];

/** The path as the client sent it (Express rewrites req.url inside mounted routers). */
const pathOf = (req: IncomingMessage) =>
  ((req as { originalUrl?: string }).originalUrl ?? req.url ?? '').split('?')[0];

/**
 * One short line per request: method, path without its query (a query may carry a search a
 * person typed, never a credential, but there is no reason to keep it), status and duration.
 */
export function requestLog(level: string, stream?: DestinationStream): RequestHandler {
  return pinoHttp({
    level,
    ...(stream ? { stream } : {}),
    redact: { paths: SECRET_PATHS, censor: '[redacted]' },
    serializers: {
      req: (req: IncomingMessage & { id?: unknown }) => ({
        id: req.id,
        method: req.method,
        path: pathOf(req),
      }),
      res: (res: ServerResponse) => ({ status: res.statusCode }),
    },
    customSuccessMessage: (req, res, ms) =>
      `${req.method} ${pathOf(req)} ${res.statusCode} ${Math.round(ms)} ms`,
    customErrorMessage: (req, res) => `${req.method} ${pathOf(req)} ${res.statusCode} failed`,
  }) as unknown as RequestHandler;
}
