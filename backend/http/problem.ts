import type { ErrorRequestHandler, RequestHandler } from 'express';
import { isOutsideModelError } from '../../shared/physics/errors';

export interface FieldError {
  /** JSON-pointer-like location of the offending input, e.g. /body/conductivity/unit. */
  path: string;
  message: string;
}

/** An error that becomes an RFC 9457 problem response with the given status. */
export class ProblemError extends Error {
  constructor(
    readonly status: number,
    readonly title: string,
    readonly detail?: string,
    readonly errors?: FieldError[],
    /** Extra response headers, e.g. Retry-After on a 503. */
    readonly headers?: Record<string, string>,
  ) {
    super(detail ?? title);
    this.name = 'ProblemError';
  }
}

const titles: Record<number, string> = {
  400: 'Bad request',
  401: 'Unauthorized',
  403: 'Forbidden',
  404: 'Not found',
  405: 'Method not allowed',
  413: 'Request body too large',
  415: 'Unsupported media type',
  422: 'Unprocessable content',
  429: 'Too many requests',
  500: 'Internal server error',
  503: 'Service unavailable',
};

interface ValidatorError {
  path?: string;
  message?: string;
}

interface HttpLikeError {
  status?: number;
  statusCode?: number;
  type?: string;
  message?: string;
  errors?: ValidatorError[];
}

/** express-openapi-validator writes paths as /body/x/y or /query/x; keep them as they are. */
function fieldErrors(err: HttpLikeError): FieldError[] | undefined {
  if (!Array.isArray(err.errors)) return undefined;
  return err.errors.map((e) => ({ path: e.path ?? '', message: e.message ?? 'invalid' }));
}

/**
 * Errors that say the database cannot be reached right now (rather than that a query was wrong):
 * Knex's pool (destroyed, or no connection within its timeout), the network, and PostgreSQL's
 * connection classes (08: connection exception; 57P01-03: shutting down or starting; 53300: too
 * many connections). They answer 503 with Retry-After, which a proxy or a client may retry.
 */
const UNAVAILABLE_CODES = new Set([
  'ECONNREFUSED',
  'ECONNRESET',
  'ETIMEDOUT',
  '08000',
  '08001',
  '08003',
  '08004',
  '08006',
  '57P01',
  '57P02',
  '57P03',
  '53300',
]);

export function databaseUnavailable(error: unknown): boolean {
  const e = error as { code?: unknown; name?: unknown; message?: unknown } | null;
  if (!e || typeof e !== 'object') return false;
  return (
    (typeof e.code === 'string' && UNAVAILABLE_CODES.has(e.code)) ||
    e.name === 'KnexTimeoutError' ||
    (typeof e.message === 'string' && e.message.startsWith('Unable to acquire a connection'))
  );
}

/**
 * The one error handler. It must come after every route so that any error a route or the
 * validator raises ends here and leaves as problem+json; nothing below 500 is logged as a fault,
 * and no stack trace ever reaches the client.
 */
export const problemHandler: ErrorRequestHandler = (error, req, res, _next) => {
  const err = error as HttpLikeError & Partial<ProblemError>;
  let status = err.status ?? err.statusCode ?? 500;
  if (!Number.isInteger(status) || status < 400 || status > 599) status = 500;
  let title = titles[status] ?? 'Error';
  let detail: string | undefined;
  let errors: FieldError[] | undefined;

  if (error instanceof ProblemError) {
    if (error.headers) res.set(error.headers);
    title = error.title;
    detail = error.detail;
    errors = error.errors;
  } else if ((error as { code?: unknown }).code === '22021') {
    // PostgreSQL cannot store this text (a NUL character that came another way than a JSON body
    // or a query, e.g. a form field): the request's fault, as on SQLite's side of
    // refuse-non-finite.ts.
    status = 400;
    title = titles[400]!;
    detail = 'Text must not contain the NUL character (U+0000).';
  } else if (databaseUnavailable(error)) {
    req.log?.error({ err: error }, 'database unavailable');
    status = 503;
    title = titles[503]!;
    detail = 'The database does not answer.';
    res.set('Retry-After', '5');
  } else if (isOutsideModelError(error)) {
    // An input outside the range where a model holds (shared/physics/errors.ts).
    status = 422;
    title = titles[422]!;
    detail = error.message;
    errors = [{ path: error.field, message: error.message }];
  } else if (err.type === 'entity.parse.failed') {
    detail = 'The request body is not valid JSON.';
    errors = [{ path: '/body', message: 'malformed JSON' }];
  } else if (err.type === 'entity.too.large') {
    detail = 'The request body is larger than this service accepts.';
  } else if (status === 400 || status === 422) {
    errors = fieldErrors(err);
    detail = errors?.length ? errors.map((e) => `${e.path}: ${e.message}`).join('; ') : err.message;
  } else if (status < 500) {
    detail = errors?.length ? errors.map((e) => `${e.path}: ${e.message}`).join('; ') : err.message;
  } else {
    req.log?.error({ err: error }, 'unhandled error');
    detail = 'The server could not complete the request.';
  }

  res
    .status(status)
    .type('application/problem+json')
    .json({
      type: errors ? 'urn:conductory:problem:invalid-input' : 'about:blank',
      title,
      status,
      ...(detail ? { detail } : {}),
      instance: req.originalUrl,
      ...(errors ? { errors } : {}),
    });
};

/** A JSON 404 for any /api path that no route answered. */
export const apiNotFound: RequestHandler = (req, _res, next) => {
  next(new ProblemError(404, 'Not found', `No API resource at ${req.method} ${req.path}`));
};
