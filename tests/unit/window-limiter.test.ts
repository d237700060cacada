// Issue 13: the limiter that replaced express-rate-limit's middleware (on its stores) must count,
// refuse and label its headers as that middleware did (IETF draft 8 RateLimit headers).
import { createHash } from 'node:crypto';
import express from 'express';
import { MemoryStore, type ClientRateLimitInfo, type Store } from 'express-rate-limit';
import request from 'supertest';
import { describe, expect, it } from 'vitest';
import { windowLimiter, windowName } from '../../backend/http/window-limiter';

class Refused extends Error {
  constructor(readonly retryAfterS: number) {
    super('refused');
  }
}

function appWith(limit: number, store?: Store, windowMs = 60_000) {
  const app = express();
  app.use(
    windowLimiter({
      store,
      windowMs,
      limit: () => limit,
      key: (req) => String(req.get('x-caller') ?? 'anyone'),
      refuse: (_req, retryAfterS) => new Refused(retryAfterS),
    }),
  );
  app.get('/', (_req, res) => {
    res.send('ok');
  });
  app.use(
    (error: unknown, _req: express.Request, res: express.Response, _next: express.NextFunction) => {
      res.status(error instanceof Refused ? 429 : 500).send(String((error as Error).message));
    },
  );
  return app;
}

/** The partition label express-rate-limit wrote: base64 of the key's SHA-256, first 12 hex digits. */
const label = (key: string) =>
  Buffer.from(createHash('sha256').update(key).digest('hex').slice(0, 12)).toString('base64');

describe('windowLimiter', () => {
  it('names windows as the policy header does', () => {
    expect(windowName(30_000)).toBe('30sec');
    expect(windowName(60_000)).toBe('1min');
    expect(windowName(15 * 60_000)).toBe('15min');
    expect(windowName(3_600_000)).toBe('1hr');
    expect(windowName(2 * 3_600_000)).toBe('2hrs');
    expect(windowName(2 * 86_400_000)).toBe('2days');
  });

  it('counts each caller apart, refuses the one over the limit with Retry-After, and labels its headers', async () => {
    const app = appWith(2);
    for (const remaining of [1, 0]) {
      const ok = await request(app).get('/').set('x-caller', 'a');
      expect(ok.status).toBe(200);
      expect(ok.headers.ratelimit).toBe(`"2-in-1min"; r=${remaining}; t=60`);
      expect(ok.headers['ratelimit-policy']).toBe(`"2-in-1min"; q=2; w=60; pk=:${label('a')}:`);
      expect(ok.headers['retry-after']).toBeUndefined();
    }
    const over = await request(app).get('/').set('x-caller', 'a');
    expect(over.status).toBe(429);
    expect(over.headers.ratelimit).toBe('"2-in-1min"; r=0; t=60');
    expect(Number(over.headers['retry-after'])).toBe(60);
    // Another caller still has the whole allowance.
    const other = await request(app).get('/').set('x-caller', 'b');
    expect(other.status).toBe(200);
    expect(other.headers.ratelimit).toBe('"2-in-1min"; r=1; t=60');
    expect(other.headers['ratelimit-policy']).toContain(`pk=:${label('b')}:`);
  });

  it('starts a new window when the last one has ended', async () => {
    const app = appWith(1, new MemoryStore(), 1000);
    expect((await request(app).get('/')).status).toBe(200);
    expect((await request(app).get('/')).status).toBe(429);
    await new Promise((r) => setTimeout(r, 1100));
    expect((await request(app).get('/')).status).toBe(200);
  });

  it('takes a store that answers at once as well as one that answers with a promise', async () => {
    const hits = new Map<string, number>();
    const resetTime = () => new Date(Date.now() + 30_000);
    const immediate = {
      localKeys: true,
      increment: (key: string): ClientRateLimitInfo => {
        hits.set(key, (hits.get(key) ?? 0) + 1);
        return { totalHits: hits.get(key)!, resetTime: resetTime() };
      },
      decrement: () => undefined,
      resetKey: () => undefined,
    } as unknown as Store;
    const app = appWith(1, immediate);
    const first = await request(app).get('/');
    expect(first.status).toBe(200);
    expect(first.headers.ratelimit).toBe('"1-in-1min"; r=0; t=30');
    const second = await request(app).get('/');
    expect(second.status).toBe(429);
    expect(second.headers['retry-after']).toBe('30');
  });

  it('passes a failing store on as an error, not as a request let through', async () => {
    const failing = {
      localKeys: true,
      increment: () => Promise.reject(new Error('store down')),
      decrement: () => undefined,
      resetKey: () => undefined,
    } as unknown as Store;
    const res = await request(appWith(5, failing)).get('/');
    expect(res.status).toBe(500);
    expect(res.text).toBe('store down');
  });
});
