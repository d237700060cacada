/**
 * Sends 100,000 readings to POST /api/v1/match/batch through a real socket and reads the NDJSON
 * answer, measuring the process's memory as it goes; prints one JSON line. Run by
 * tests/api/match-batch.test.ts in a process of its own, started with --expose-gc, so that what
 * other tests left behind does not blur the figures:
 *
 *   node --expose-gc --import tsx tests/helpers/batch-memory-probe.ts
 *
 * The live heap is sampled after a full collection (global.gc) every 250 ms: it counts what the
 * batch holds, not garbage waiting for the collector. Peak RSS is sampled too, without a bound.
 */
import http from 'node:http';
import type { AddressInfo } from 'node:net';
import { Readable } from 'node:stream';

import request from 'supertest';
import { demo, sessionCookieOf } from './access';
import { createTestApp, TEST_PUBLIC_URL } from './test-app';

const ROWS = 100_000;
const gc = (globalThis as { gc?: () => void }).gc;
if (!gc) throw new Error('run with node --expose-gc');

const t = await createTestApp({ accounts: true });
const { email, password } = demo('integrator');
const signIn = await request(t.app)
  .post('/api/v1/auth/sign-in')
  .set('Origin', TEST_PUBLIC_URL)
  .send({ email, password });
const cookie = `conductory_session=${sessionCookieOf(signIn.headers['set-cookie'])}`;

const server = http.createServer(t.app).listen(0, '127.0.0.1');
await new Promise((resolve) => server.once('listening', resolve));
const { port } = server.address() as AddressInfo;

/** Invented readings across the table's range, 1000 to a chunk, made as they are sent. */
function* upload() {
  yield 'id,conductivity (%IACS),temperature (C),density (g/cm3),frequency (kHz)\r\n';
  for (let i = 0; i < ROWS; i += 1000) {
    let chunk = '';
    for (let k = i; k < i + 1000; k++)
      chunk += `line-${k},${(2 + (k % 980) / 10).toFixed(1)},${15 + (k % 20)},${(2.5 + (k % 70) / 10).toFixed(2)},60\r\n`;
    yield chunk;
  }
}

gc();
const before = process.memoryUsage();
let peakHeap = before.heapUsed;
let peakRss = before.rss;
const sample = setInterval(
  () => {
    gc();
    const m = process.memoryUsage();
    peakHeap = Math.max(peakHeap, m.heapUsed);
    peakRss = Math.max(peakRss, m.rss);
  },
  Number(process.env.PROBE_MS ?? 250),
);

const answer = await new Promise<{ status: number; lines: number; bytes: number; rows: string }>(
  (resolve, reject) => {
    const req = http.request(
      {
        host: '127.0.0.1',
        port,
        method: 'POST',
        path: '/api/v1/match/batch',
        headers: {
          'Content-Type': 'text/csv',
          Accept: 'application/x-ndjson',
          Cookie: cookie,
          Origin: TEST_PUBLIC_URL,
        },
      },
      (res) => {
        let lines = 0;
        let bytes = 0;
        res.on('data', (chunk: Buffer) => {
          bytes += chunk.length;
          for (const b of chunk) if (b === 0x0a) lines++;
        });
        res.on('end', () =>
          resolve({
            status: res.statusCode!,
            lines,
            bytes,
            rows: String(res.headers['x-batch-rows']),
          }),
        );
        res.on('error', reject);
      },
    );
    req.on('error', reject);
    Readable.from(upload()).pipe(req);
  },
);
clearInterval(sample);
server.close();
await t.knex.destroy();
console.log(
  JSON.stringify({
    ...answer,
    heapGrowthBytes: peakHeap - before.heapUsed,
    rssGrowthBytes: peakRss - before.rss,
  }),
);
process.exit(0);
