/**
 * Batch Match against single Matches, side by side on the same server: 10,000 invented readings
 * sent as one POST /api/v1/match/batch, and the same readings as POST /api/v1/match requests
 * (a subset, extrapolated to 10,000). The single requests go ten at a time over kept-alive
 * connections, as a client script in a hurry would send them; sent one at a time they would
 * cost more still, so the ratio printed is the conservative one. Issue 12 aims at ≥ 20×.
 */
import { demoAccounts } from '../seeds/demo/accounts';

export const BATCH_ROWS = 10_000;
/** Single requests actually sent; their time is scaled to BATCH_ROWS. */
const SINGLES = Number(process.env.BENCH_SINGLES ?? 1_000);
const CONCURRENCY = 10;
const BATCH_RUNS = 3;

interface Reading {
  id: string;
  iacs: number;
  celsius: number;
  density: number;
}

/** Invented readings spread over the table (2 to 100 %IACS, 15 to 34 °C, 2.5 to 9.4 g/cm³). */
function readings(): Reading[] {
  return Array.from({ length: BATCH_ROWS }, (_, k) => ({
    id: `bench-${k}`,
    iacs: Number((2 + (k % 980) / 10).toFixed(1)),
    celsius: 15 + (k % 20),
    density: Number((2.5 + (k % 70) / 10).toFixed(2)),
  }));
}

/** An integrator's API key on the bench server (the demo accounts are loaded there). */
async function integratorKey(base: string): Promise<string> {
  const who = demoAccounts.find((a) => a.role === 'integrator')!;
  const signIn = await fetch(`${base}/api/v1/auth/sign-in`, {
    method: 'POST',
    headers: { 'content-type': 'application/json', origin: base },
    body: JSON.stringify({ email: who.email, password: who.password }),
  });
  const cookie = signIn.headers
    .getSetCookie()
    .map((c) => c.split(';')[0])
    .join('; ');
  const key = await fetch(`${base}/api/v1/keys`, {
    method: 'POST',
    headers: { 'content-type': 'application/json', origin: base, cookie },
    body: JSON.stringify({ name: 'bench', role: 'integrator' }),
  });
  if (key.status !== 201) throw new Error(`bench: no API key (${key.status})`);
  return ((await key.json()) as { key: string }).key;
}

export interface BatchBench {
  batchMs: number;
  singleMsEach: number;
  singlesSent: number;
  rows: number;
}

export async function benchBatchMatch(port: number): Promise<BatchBench> {
  const base = `http://127.0.0.1:${port}`;
  const auth = { authorization: `Bearer ${await integratorKey(base)}` };
  const data = readings();
  const csv =
    'id,conductivity (%IACS),temperature (C),density (g/cm3)\r\n' +
    data.map((r) => `${r.id},${r.iacs},${r.celsius},${r.density}`).join('\r\n');

  const times: number[] = [];
  let lines = 0;
  for (let run = 0; run < BATCH_RUNS; run++) {
    const start = performance.now();
    const res = await fetch(`${base}/api/v1/match/batch`, {
      method: 'POST',
      headers: { ...auth, 'content-type': 'text/csv', accept: 'text/csv' },
      body: csv,
    });
    const text = await res.text();
    times.push(performance.now() - start);
    if (res.status !== 200) throw new Error(`bench: batch answered ${res.status}: ${text}`);
    lines = text.trimEnd().split('\r\n').length - 1;
  }
  if (lines !== BATCH_ROWS) throw new Error(`bench: ${lines} lines for ${BATCH_ROWS} readings`);
  times.sort((a, b) => a - b);

  let next = 0;
  const worker = async () => {
    while (next < SINGLES) {
      const r = data[next++]!;
      const res = await fetch(`${base}/api/v1/match`, {
        method: 'POST',
        headers: { ...auth, 'content-type': 'application/json' },
        body: JSON.stringify({
          conductivity: { value: r.iacs, unit: '%IACS' },
          temperature: { value: r.celsius, unit: 'C' },
          density: { value: r.density, unit: 'g/cm3' },
          limit: 3,
        }),
      });
      await res.arrayBuffer();
      if (res.status !== 200) throw new Error(`bench: single Match answered ${res.status}`);
    }
  };
  const start = performance.now();
  await Promise.all(Array.from({ length: CONCURRENCY }, worker));
  const singlesMs = performance.now() - start;
  return {
    batchMs: times[Math.floor(BATCH_RUNS / 2)]!,
    singleMsEach: singlesMs / SINGLES,
    singlesSent: SINGLES,
    rows: BATCH_ROWS,
  };
}

export function printBatchBench(b: BatchBench): void {
  const singlesMs = b.singleMsEach * b.rows;
  console.log(
    `\nBatch Match of ${b.rows.toLocaleString('en-US')} readings against ${b.rows.toLocaleString('en-US')} single Matches (same server, same readings):` +
      `\n  one POST /match/batch (text/csv in and out, median of ${BATCH_RUNS}): ${(b.batchMs / 1000).toFixed(2)} s, ${((b.rows / b.batchMs) * 1000).toFixed(0)} readings/s` +
      `\n  POST /match, ${CONCURRENCY} at a time: ${b.singleMsEach.toFixed(2)} ms each over ${b.singlesSent.toLocaleString('en-US')} sent, so ${(singlesMs / 1000).toFixed(1)} s for ${b.rows.toLocaleString('en-US')}` +
      `\n  batch is ${(singlesMs / b.batchMs).toFixed(0)}× faster (aim, issue 12: ≥ 20×)`,
  );
}
