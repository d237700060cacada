// Issue 13: the app mounts fixed sequences of middleware as one layer (backend/http/chain.ts) and
// sets helmet's headers from one start-up run (security-headers.ts). Both must behave as before.
import express, { type RequestHandler } from 'express';
import helmet from 'helmet';
import request from 'supertest';
import { describe, expect, it } from 'vitest';
import { chain } from '../../backend/http/chain';
import { securityHeaders } from '../../backend/http/security-headers';

const answer: RequestHandler = (_req, res) => {
  res.json({ reached: true });
};
const errors: express.ErrorRequestHandler = (error, _req, res, _next) => {
  res.status(500).json({ error: String((error as Error).message ?? error) });
};
const appWith = (handlers: RequestHandler[]) => {
  const app = express();
  app.use(chain(handlers));
  app.get('/', answer);
  app.use(errors);
  return app;
};

describe('chain', () => {
  it('runs every middleware in order, then the next layer', async () => {
    const seen: string[] = [];
    const step =
      (name: string): RequestHandler =>
      (_req, _res, next) => {
        seen.push(name);
        next();
      };
    const res = await request(appWith([step('a'), step('b'), step('c')])).get('/');
    expect(res.body).toEqual({ reached: true });
    expect(seen).toEqual(['a', 'b', 'c']);
  });

  it('leaves at next(error), a thrown error or a rejected promise, and skips the rest', async () => {
    const never: RequestHandler = () => {
      throw new Error('should not run');
    };
    const passes: RequestHandler = (_req, _res, next) => next(new Error('passed'));
    const throws: RequestHandler = () => {
      throw new Error('thrown');
    };
    const rejects: RequestHandler = async () => {
      await Promise.resolve();
      throw new Error('rejected');
    };
    for (const [first, message] of [
      [passes, 'passed'],
      [throws, 'thrown'],
      [rejects, 'rejected'],
    ] as const) {
      const res = await request(appWith([first, never])).get('/');
      expect(res.status).toBe(500);
      expect(res.body).toEqual({ error: message });
    }
  });

  it('lets a middleware answer on its own', async () => {
    const answers: RequestHandler = (_req, res) => {
      res.status(204).end();
    };
    expect((await request(appWith([answers])).get('/')).status).toBe(204);
  });
});

describe('securityHeaders', () => {
  it('sends exactly the headers helmet sends', async () => {
    const options = { contentSecurityPolicy: { directives: { upgradeInsecureRequests: null } } };
    const viaHelmet = express().use(helmet(options)).get('/', answer);
    const once = express().use(securityHeaders(options)).get('/', answer);
    const strip = (h: Record<string, unknown>) => {
      const { date: _d, etag: _e, 'content-length': _l, 'x-powered-by': _p, ...rest } = h;
      return rest;
    };
    const a = await request(viaHelmet).get('/');
    const b = await request(once).get('/');
    expect(strip(b.headers)).toEqual(strip(a.headers));
    expect(Object.keys(strip(b.headers)).length).toBeGreaterThan(10);
  });
});
