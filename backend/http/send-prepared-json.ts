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
