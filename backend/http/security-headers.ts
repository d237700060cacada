import type { IncomingMessage, ServerResponse } from 'node:http';
import type { RequestHandler } from 'express';
import helmet, { type HelmetOptions } from 'helmet';

/**
 * helmet's headers, worked out once. helmet is a chain of a dozen small middlewares, each setting
 * one header to the same value on every request; here no value depends on the request (no CSP
 * nonces), so helmet runs once at start-up on a stand-in response that records what it sets, and
 * one middleware sets those headers on every response. Same headers, a dozen fewer calls per
 * request (issue 13's profile).
 */
export function securityHeaders(options: HelmetOptions): RequestHandler {
  const headers: Array<[string, string]> = [];
  const recorder = {
    setHeader: (name: string, value: unknown) => headers.push([name, String(value)]),
    // X-Powered-By is the only header helmet removes; the app never sets it (x-powered-by off).
    removeHeader: () => undefined,
  };
  let finished = false;
  helmet(options)(
    {} as IncomingMessage,
    recorder as unknown as ServerResponse,
    (error?: unknown) => {
      if (error) throw error;
      finished = true;
    },
  );
  // A helmet that needed the request or finished later could not be computed once: say so.
  if (!finished) throw new Error('helmet did not set its headers synchronously');
  return (_req, res, next) => {
    for (const [name, value] of headers) res.setHeader(name, value);
    next();
  };
}
