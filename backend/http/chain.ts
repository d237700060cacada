import type { NextFunction, Request, RequestHandler, Response } from 'express';

/**
 * Several middlewares mounted as one layer. Express 5 spends a few microseconds on every layer a
 * request passes (the path match, parameters, a promise check), and an API request used to pass
 * some twenty (issue 13's profile); a fixed sequence that always runs together costs one layer
 * this way. As in Express: next(error) leaves the sequence at once, and a thrown error or a
 * rejected promise (an async middleware) is passed on as next(error).
 */
export function chain(handlers: RequestHandler[]): RequestHandler {
  return (req, res, next) => runFrom(handlers, 0, req, res, next);
}

/**
 * Runs handlers[index] with a `next` that runs the one after it. The callback is written inline:
 * a named closure made per request costs a helper call each time under tsx (esbuild's keepNames).
 */
function runFrom(
  handlers: RequestHandler[],
  index: number,
  req: Request,
  res: Response,
  next: NextFunction,
): void {
  const handler = handlers[index];
  if (!handler) return next();
  try {
    const result = handler(req, res, (error?: unknown) =>
      error !== undefined && error !== null
        ? next(error)
        : runFrom(handlers, index + 1, req, res, next),
    ) as unknown;
    if (result instanceof Promise) result.catch(next);
  } catch (thrown) {
    next(thrown);
  }
}
