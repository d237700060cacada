/**
 * The servers the benchmark compares, in a process of their own so that the load generator does
 * not share their event loop: the product (on a fresh seeded database); bare Express with the
 * product's compression setting; and bare node:http. The bare ones answer each case with the
 * product's own answer to it, captured once at start-up, so a ratio isolates what our middleware,
 * validation and search cost per request, not the difference between a 40-byte object and several
 * kB of JSON.
 */
import fs from 'node:fs';
import http from 'node:http';
import os from 'node:os';
import path from 'node:path';
import compression from 'compression';
import express from 'express';
import type { AddressInfo } from 'node:net';
import crypto from 'node:crypto';
import { createApp } from '../backend/app';
import { createMailer } from '../backend/mail/mailer';
import { createOutboxRepository } from '../backend/mail/outbox-repository';
import { createKnex } from '../backend/db/knex';
import { prepareDatabase } from '../backend/db/prepare';
import { productCases, type BenchPorts } from './cases';

const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'conductory-bench-'));
const knex = createKnex(path.join(dir, 'bench.sqlite'));
// The demo accounts too: the batch Match bench calls as the demo integrator.
await prepareDatabase(knex, { demo: true, demoAccounts: true });
// Logged as `npm start` logs (info, one line per request); the parent sends this process's
// stdout to /dev/null so the lines cost what they cost in production, without flooding the report.
// Rate limits are lifted: the benchmark measures the service, not the limiter's 429s.
const unlimited = { visitor: 1e9, reader: 1e9, integrator: 1e9, curator: 1e9, admin: 1e9 };
const product = createApp({
  knex,
  mailer: await createMailer(createOutboxRepository(knex)),
  jwtSecret: crypto.randomBytes(32),
  publicUrl: () => 'http://127.0.0.1',
  serveClient: false,
  // As a deployment runs it (NODE_ENV=production): answers are not re-validated against
  // openapi.yaml there; development and the tests do validate them.
  production: true,
  logLevel: process.env.LOG_LEVEL ?? 'info',
  rateLimits: unlimited,
  estimateLimits: unlimited,
}).listen(0, '127.0.0.1');
await new Promise((r) => product.once('listening', r));
const productPort = (product.address() as AddressInfo).port;

// The product's answer to each case, once.
const answers = new Map<string, Buffer>();
for (const c of productCases) {
  const res = await fetch(`http://127.0.0.1:${productPort}${c.path}`, {
    method: c.method,
    headers: c.body ? { 'content-type': 'application/json' } : {},
    body: c.body ? JSON.stringify(c.body) : undefined,
  });
  if (res.status !== 200) throw new Error(`${c.name}: the product answered ${res.status}`);
  answers.set(c.key, Buffer.from(await res.arrayBuffer()));
}

const bare = express();
bare.disable('x-powered-by');
bare.use(compression());
bare.use(express.json());
for (const c of productCases) {
  const bytes = answers.get(c.key)!;
  bare[c.method === 'GET' ? 'get' : 'post'](`/bare/${c.key}`, (_req, res) => {
    res.type('application/json').send(bytes);
  });
}
const expressServer = bare.listen(0, '127.0.0.1');

const nodeServer = http.createServer((req, res) => {
  const bytes = answers.get((req.url ?? '').replace(/^\/bare\//, ''));
  // Read the body (a POST's) before answering, as the others do.
  req.resume();
  req.on('end', () => {
    if (!bytes) {
      res.writeHead(404).end();
      return;
    }
    res.writeHead(200, { 'content-type': 'application/json', 'content-length': bytes.length });
    res.end(bytes);
  });
});
nodeServer.listen(0, '127.0.0.1');

await Promise.all(
  [expressServer, nodeServer].map((s) => new Promise((r) => s.once('listening', r))),
);
process.send?.({
  product: productPort,
  express: (expressServer.address() as AddressInfo).port,
  node: (nodeServer.address() as AddressInfo).port,
  bytes: Object.fromEntries([...answers].map(([k, v]) => [k, v.length])),
} satisfies BenchPorts);
// The parent asks for this process's peak resident set size (kB) before it disconnects.
process.on('message', (message) => {
  if (message === 'peak-rss') process.send?.({ peakRssKb: process.resourceUsage().maxRSS });
});
process.on('disconnect', () => {
  product.close();
  expressServer.close();
  nodeServer.close();
  void knex.destroy().then(() => fs.rmSync(dir, { recursive: true, force: true }));
});
