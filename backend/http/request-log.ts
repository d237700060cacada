import type { IncomingMessage } from 'node:http';
import type { Application, Request, RequestHandler } from 'express';
import { pino, type DestinationStream, type Logger } from 'pino';

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

declare module 'node:http' {
  interface IncomingMessage {
    /** This request's logger: the request's id, method and path on every line it writes. */
    log: Logger;
  }
}

const REQUEST_ID = Symbol('request id');
type Numbered = IncomingMessage & { [REQUEST_ID]?: number };

/** The path as the client sent it (Express rewrites req.url inside mounted routers). */
const pathOf = (req: IncomingMessage) =>
  ((req as { originalUrl?: string }).originalUrl ?? req.url ?? '').split('?')[0]!;

/** Lines are written in batches, at least once a second (see bufferedStdout). */
const FLUSH_EVERY_MS = 1000;

/**
 * Standard output, written in batches of 4 kB rather than one system call per line (pino's
 * asynchronous logging): the write per request cost as much as the rest of the log line (issue
 * 13's profile). pino flushes it when the process exits or is stopped; a timer flushes it every
 * second too, so that a quiet server's last lines are not kept back. A power cut can lose the
 * last second of request lines, which is acceptable for them (errors are written the same way).
 */
function bufferedStdout(): DestinationStream {
  const destination = pino.destination({ dest: 1, minLength: 4096, sync: false });
  setInterval(() => {
    try {
      destination.flush();
    } catch {
      // Destroyed at exit: nothing left to flush.
    }
  }, FLUSH_EVERY_MS).unref();
  return destination;
}

/**
 * One short line per request: method, path without its query (a query may carry a search a
 * person typed, never a credential, but there is no reason to keep it), status and duration.
 *
 * Written on pino directly rather than through pino-http: that made a child logger per request
 * (with the redaction paths compiled into its bindings) and serialized the request and response
 * objects, which cost as much as a catalogue search itself (issue 13's profile). Here a request
 * costs one listener and, when it ends, one line. `req.log` stays available to the error handlers:
 * the child logger carrying the request is made only when something asks for it.
 */
export function requestLog(
  app: Application,
  level: string,
  stream?: DestinationStream,
): RequestHandler {
  const options = { level, redact: { paths: SECRET_PATHS, censor: '[redacted]' } };
  const destination = stream ?? (level === 'silent' ? undefined : bufferedStdout());
  const logger = pino(options, destination);
  // The request line holds only the id, method, path, status and time, never a header or body:
  // it is written without redaction's pass over each entry (about 5 µs a request). The loggers
  // that error handlers use (req.log) keep it.
  const lines = pino({ level }, destination);
  let lastId = 0;
  const describe = (req: IncomingMessage) => ({
    id: (req as Numbered)[REQUEST_ID],
    method: req.method,
    path: pathOf(req),
  });
  const children = new WeakMap<IncomingMessage, Logger>();
  Object.defineProperty((app as unknown as { request: object }).request, 'log', {
    configurable: true,
    get(this: Request) {
      let child = children.get(this);
      if (!child) children.set(this, (child = logger.child({ req: describe(this) })));
      return child;
    },
  });
  if (!logger.isLevelEnabled('info')) return (_req, _res, next) => next();
  return (req, res, next) => {
    const started = performance.now();
    (req as Numbered)[REQUEST_ID] = ++lastId;
    res.once('close', () => {
      const ms = Math.round(performance.now() - started);
      const status = res.statusCode;
      const request = describe(req);
      const entry = { req: request, res: { status }, responseTime: ms };
      const line = `${request.method} ${request.path}`;
      if (!res.writableFinished) lines.warn(entry, `${line} closed by the client after ${ms} ms`);
      else if (status >= 500) lines.error(entry, `${line} ${status} failed`);
      else lines.info(entry, `${line} ${status} ${ms} ms`);
    });
    next();
  };
}
