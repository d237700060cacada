/**
 * The two servers the benchmark compares, in a process of their own so that the load generator
 * does not share their event loop: the product (on a fresh seeded database) and a bare Express
 * endpoint that answers a fixed JSON object, the floor of what Express itself costs.
 */
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import express from 'express';
import type { AddressInfo } from 'node:net';
import crypto from 'node:crypto';
import { createApp } from '../backend/app';
import { createMailer } from '../backend/mail/mailer';
import { createOutboxRepository } from '../backend/mail/outbox-repository';
import { createKnex } from '../backend/db/knex';
import { prepareDatabase } from '../backend/db/prepare';

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
  logLevel: process.env.LOG_LEVEL ?? 'info',
  rateLimits: unlimited,
  estimateLimits: unlimited,
}).listen(0, '127.0.0.1');

const bare = express();
bare.disable('x-powered-by');
bare.use(express.json());
const payload = { status: 'ok', items: [{ slug: 'x', value: 1 }] };
bare.get('/json', (_req, res) => {
  res.json(payload);
});
bare.post('/json', (_req, res) => {
  res.json(payload);
});
const bareServer = bare.listen(0, '127.0.0.1');

await Promise.all([product, bareServer].map((s) => new Promise((r) => s.once('listening', r))));
process.send?.({
  product: (product.address() as AddressInfo).port,
  bare: (bareServer.address() as AddressInfo).port,
});
process.on('disconnect', () => {
  product.close();
  bareServer.close();
  void knex.destroy().then(() => fs.rmSync(dir, { recursive: true, force: true }));
});
