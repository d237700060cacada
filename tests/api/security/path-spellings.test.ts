// Deny by default (quality.md, OWASP ASVS V4): every other spelling of an operation's path is a
// 404 before any handler runs, for visitors and readers alike; HEAD, undeclared, is a 405.
// Requests go out through node:http so that dot segments and double slashes reach the server as
// written (supertest's URL handling would tidy them away first).
import http from 'node:http';
import request from 'supertest';
import type { AddressInfo } from 'node:net';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { loadApiDocument } from '../../../backend/api-document';
import { demo, sessionCookieOf, signedIn } from '../../helpers/access';
import { createTestApp, TEST_PUBLIC_URL, type TestApp } from '../../helpers/test-app';

let t: TestApp;
let server: http.Server;
let port = 0;
let readerCookie = '';

interface Reply {
  status: number;
  type: string;
  body: string;
}

function send(method: string, path: string, cookie?: string): Promise<Reply> {
  return new Promise((resolve, reject) => {
    const req = http.request(
      {
        host: '127.0.0.1',
        port,
        method,
        path,
        headers: {
          'content-type': 'application/json',
          origin: TEST_PUBLIC_URL,
          ...(cookie ? { cookie: `conductory_session=${cookie}` } : {}),
        },
      },
      (res) => {
        let body = '';
        res.on('data', (c: Buffer) => (body += c.toString()));
        res.on('end', () =>
          resolve({ status: res.statusCode!, type: res.headers['content-type'] ?? '', body }),
        );
      },
    );
    req.on('error', reject);
    if (!['GET', 'HEAD', 'DELETE'].includes(method)) req.write('{}');
    req.end();
  });
}

beforeAll(async () => {
  t = await createTestApp({ accounts: true });
  server = t.app.listen(0, '127.0.0.1');
  await new Promise((r) => server.once('listening', r));
  port = (server.address() as AddressInfo).port;
  const r = demo('reader');
  const signIn = await new Promise<string[]>((resolve, reject) => {
    const req = http.request(
      {
        host: '127.0.0.1',
        port,
        method: 'POST',
        path: '/api/v1/auth/sign-in',
        headers: { 'content-type': 'application/json' },
      },
      (res) => {
        res.resume();
        res.on('end', () => resolve(res.headers['set-cookie'] ?? []));
      },
    );
    req.on('error', reject);
    req.end(JSON.stringify({ email: r.email, password: r.password }));
  });
  readerCookie = sessionCookieOf(signIn)!;
  expect(readerCookie).toBeTruthy();
});
afterAll(async () => {
  server.close();
  await t.knex.destroy();
});

const operations = Object.entries(loadApiDocument().paths).flatMap(([path, ops]) =>
  Object.entries(ops).map(([method, op]) => ({
    method: method.toUpperCase(),
    path,
    roles: (op as { 'x-roles': string[] })['x-roles'],
  })),
);
const fill = (p: string) =>
  p.replace('{slug}', 'copper-c11000').replace('{id}', '1').replace('{version}', '2026.12.0');

/** Other ways to write the same path; none of them may reach the operation. */
export function spellings(filled: string): Record<string, string> {
  const [, first = '', ...rest] = filled.split('/');
  const tail = rest.length ? `/${rest.join('/')}` : '';
  const hex = first.charCodeAt(0).toString(16);
  return {
    'upper case': `/api/v1${filled.toUpperCase()}`,
    'capital first letter': `/api/v1/${first[0]!.toUpperCase()}${first.slice(1)}${tail}`,
    'percent-encoded letter': `/api/v1/%${hex}${first.slice(1)}${tail}`,
    'percent-encoded letter, upper hex': `/api/v1/%${hex.toUpperCase()}${first.slice(1)}${tail}`,
    'trailing slash': `/api/v1${filled}/`,
    'double slash before': `/api/v1/${filled}`,
    'double slash inside': `/api/v1/${first}/${tail || '/'}`,
    'dot segment': `/api/v1/.${filled}`,
    'dot-dot segment': `/api/v1/x/..${filled}`,
    'encoded dot-dot': `/api/v1/x/%2e%2e${filled}`,
    'upper-case prefix': `/API/V1${filled}`,
    'encoded prefix': `/%61pi/v1${filled}`,
    'no version': `/api${filled}`,
  };
}

const cases = operations.flatMap((op) =>
  Object.entries(spellings(fill(op.path))).flatMap(([kind, path]) =>
    ['visitor', 'reader'].map((caller) => ({ ...op, kind, spelled: path, caller })),
  ),
);

describe('other spellings of every operation’s path', () => {
  it.each(cases)('$caller $method $spelled ($kind) → 404', async (c) => {
    const res = await send(c.method, c.spelled, c.caller === 'reader' ? readerCookie : undefined);
    expect(res.status, `${c.method} ${c.spelled} → ${res.status} ${res.body}`).toBe(404);
    expect(res.type).toMatch(/application\/problem\+json/);
  });
});

describe('HEAD, which openapi.yaml does not declare, is a 405 everywhere', () => {
  const heads = operations
    .filter((op) => op.path !== '/auth/sign-out')
    .flatMap((op) => ['visitor', 'reader'].map((caller) => ({ ...op, caller })));
  it.each(heads)('$caller HEAD $path (of $method)', async (c) => {
    const res = await send(
      'HEAD',
      `/api/v1${fill(c.path)}`,
      c.caller === 'reader' ? readerCookie : undefined,
    );
    expect(res.status, `HEAD ${c.path}`).toBe(405);
  });
});

describe('the canonical path still works', () => {
  it('GET /api/v1/alloys/copper-c11000 → 200; GET /api/v1/users as a reader → 403', async () => {
    expect((await send('GET', '/api/v1/alloys/copper-c11000')).status).toBe(200);
    expect((await send('GET', '/api/v1/users', readerCookie)).status).toBe(403);
    expect((await send('GET', '/api/v1/users')).status).toBe(401);
  });
  it('a known path with another method → 405 with Allow', async () => {
    const res = await send('DELETE', '/api/v1/alloys');
    expect(res.status).toBe(405);
  });
});

describe('issue 8 reproducers: case-shifted paths as a visitor', () => {
  it('GET /api/v1/USERS, /api/v1/Admin/Outbox, /api/v1/AUDIT → 404, not 200', async () => {
    for (const p of ['/api/v1/USERS', '/api/v1/Admin/Outbox', '/api/v1/AUDIT'])
      expect((await request(t.app).get(p)).status, p).toBe(404);
  });
  it('PATCH /api/v1/Users/1 {"role":"admin"} → 404 and nobody’s role changes', async () => {
    const before = await t.knex('users').select('id', 'role').orderBy('id');
    const res = await request(t.app).patch('/api/v1/Users/1').send({ role: 'admin' });
    expect(res.status).toBe(404);
    expect(await t.knex('users').select('id', 'role').orderBy('id')).toEqual(before);
  });
  it('POST /api/v1/Revisions/{id}/review → 404, and the revision stays pending', async () => {
    const curator = await signedIn(t.app, 'curator');
    const proposed = await curator
      .post('/api/v1/revisions')
      .set('Origin', TEST_PUBLIC_URL)
      .send({
        kind: 'edit',
        alloy: 'cartridge-brass-c26000',
        set: { values: { conductivity: { nominal: 16.0e6, min: 15.66e6, max: 16.82e6 } } },
        source: { citation: 'Lot sheet (invented for the test)', kind: 'measurement_set' },
        reason: 'Lot measurements read 27.6 %IACS on average',
      });
    expect(proposed.status).toBe(201);
    const res = await request(t.app)
      .post(`/api/v1/Revisions/${proposed.body.id}/review`)
      .send({ decision: 'reject', comment: 'a stranger says no' });
    expect(res.status).toBe(404);
    const row = await t.knex('revisions').where('id', proposed.body.id).first();
    expect(row.status).toBe('pending');
  });
});
