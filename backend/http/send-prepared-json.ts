import type { Request, Response } from 'express';

/** A JSON answer serialized once (a cached search page), to be sent many times. */
export interface PreparedJson {
  page: unknown;
  bytes: Buffer;
  etag?: string;
}

/**
 * Sends an answer whose JSON was made once, as res.json would send it: the same bytes, the same
 * Content-Type, the same ETag (Express's own function, so If-None-Match still earns a 304).
 * Where answers are checked against openapi.yaml (development, tests: app.locals.validateResponses)
 * it goes through res.json, which the validator watches; a production server sends the bytes.
 * tests/api/prepared-json.test.ts holds the two ways to the same bytes and headers.
 */
export function sendPreparedJson(req: Request, res: Response, answer: PreparedJson): void {
  if (req.app.locals.validateResponses) {
    res.json(answer.page);
    return;
  }
  const etagOf = req.app.get('etag fn') as ((body: Buffer) => string) | undefined;
  if (etagOf) res.set('ETag', (answer.etag ??= etagOf(answer.bytes)));
  res.set('Content-Type', 'application/json; charset=utf-8');
  res.send(answer.bytes);
}

/**
 * Sends the answer to a POST that computes something (Match), as res.json would but without an
 * ETag: res.send hashes the whole answer for one, and no client can revalidate a POST with it.
 * Where answers are checked against openapi.yaml it goes through res.json, as above.
 */
export function sendComputedJson(req: Request, res: Response, body: unknown): void {
  if (req.app.locals.validateResponses) {
    res.json(body);
    return;
  }
  const bytes = Buffer.from(JSON.stringify(body));
  res.setHeader('Content-Type', 'application/json; charset=utf-8');
  res.setHeader('Content-Length', bytes.length);
  res.end(bytes);
}
