// Issue 13: each /api/v1 request goes to the one router serving its operation. The app must not
// start when openapi.yaml and the routes disagree, either way.
import { Router } from 'express';
import { describe, expect, it } from 'vitest';
import type { ApiDocument } from '../../backend/api-document';
import { dispatchByOperation } from '../../backend/http/dispatch-operation';

const op = { 'x-roles': ['visitor'] };
const doc = {
  paths: { '/alloys': { get: op }, '/alloys/{slug}': { get: op }, '/alloys/export': { get: op } },
} as unknown as ApiDocument;
const ok = () => undefined;

describe('dispatchByOperation', () => {
  it('starts when every operation has a route and every route an operation', () => {
    const a = Router().get('/alloys', ok).get('/alloys/:slug', ok);
    const b = Router().get('/alloys/export', ok);
    expect(() => dispatchByOperation([a, b], doc)).not.toThrow();
  });

  it('refuses an operation without a route', () => {
    const a = Router().get('/alloys', ok).get('/alloys/:slug', ok);
    expect(() => dispatchByOperation([a], doc)).toThrow(/GET \/alloys\/export has no route/);
  });

  it('refuses a route openapi.yaml does not describe', () => {
    const a = Router().get('/alloys', ok).get('/alloys/:slug', ok).get('/alloys/export', ok);
    const extra = Router().delete('/alloys/:slug', ok);
    expect(() => dispatchByOperation([a, extra], doc)).toThrow(/DELETE \/alloys\/\{\}/);
  });
});
