/**
 * `npm run bench`: catalogue search and Match against a bare Express JSON endpoint, with autocannon
 * on loopback in the same run; prints throughput, p50/p99 latency and the ratio to the bare
 * endpoint; then a batch Match of 10,000 readings against as many single Matches. Ratios travel between machines; absolute numbers do not. No assertion: a report.
 */
import { fork } from 'node:child_process';
import path from 'node:path';
import autocannon from 'autocannon';
import { projectRoot } from '../backend/paths';
import { benchPhysics } from './physics';
import { benchSortPlan } from './sort-plan';
import { benchBatchMatch, printBatchBench } from './match-batch';
import { initialJavaScript, INITIAL_JS_BUDGET_KB } from './initial-js';
import { heaviestLaunch } from '../tests/helpers/launches';

const DURATION_S = Number(process.env.BENCH_SECONDS ?? 5);
const CONNECTIONS = 10;

interface Case {
  name: string;
  target: 'bare' | 'product';
  method: 'GET' | 'POST';
  path: string;
  body?: unknown;
}

const cases: Case[] = [
  { name: 'bare Express GET /json', target: 'bare', method: 'GET', path: '/json' },
  {
    name: 'catalogue search q=brass',
    target: 'product',
    method: 'GET',
    path: '/api/v1/alloys?q=brass',
  },
  {
    name: 'catalogue filter, sorted',
    target: 'product',
    method: 'GET',
    path: '/api/v1/alloys?family=aluminium&sort=-conductivity',
  },
  {
    name: 'bare Express POST /json',
    target: 'bare',
    method: 'POST',
    path: '/json',
    body: { conductivity: { value: 28, unit: '%IACS' } },
  },
  {
    name: 'Match (28 %IACS, 8.53 g/cm³)',
    target: 'product',
    method: 'POST',
    path: '/api/v1/match',
    body: { conductivity: { value: 28, unit: '%IACS' }, density: { value: 8.53, unit: 'g/cm3' } },
  },
];

const servers = fork(path.join(projectRoot, 'bench', 'servers.ts'), {
  execArgv: ['--import', 'tsx'],
  stdio: ['ignore', 'ignore', 'inherit', 'ipc'],
});
const ports = await new Promise<{ product: number; bare: number }>((resolve) =>
  servers.once('message', resolve as never),
);

const rows: Array<{ name: string; rps: number; p50: number; p99: number; errors: number }> = [];
for (const c of cases) {
  process.stdout.write(`  ${c.name}…\n`);
  const result = await autocannon({
    url: `http://127.0.0.1:${ports[c.target]}${c.path}`,
    method: c.method,
    connections: CONNECTIONS,
    duration: DURATION_S,
    headers: c.body ? { 'content-type': 'application/json' } : {},
    body: c.body ? JSON.stringify(c.body) : undefined,
  });
  rows.push({
    name: c.name,
    rps: result.requests.average,
    p50: result.latency.p50,
    p99: result.latency.p99,
    errors: result.errors + result.non2xx,
  });
}

/**
 * /health while the calculators are saturated: launch requests at the schema's largest filament
 * counts (each runs into the compute limit) keep every worker thread busy and the queue full,
 * and autocannon measures how long /health waits meanwhile. On the event loop, three such
 * launches once kept /health waiting 17 s.
 */
async function healthUnderLoad() {
  const base = `http://127.0.0.1:${ports.product}`;
  let stop = false;
  const statuses = new Map<number, number>();
  const launcher = async () => {
    while (!stop) {
      const res = await fetch(`${base}/api/v1/estimates/launch`, {
        method: 'POST',
        headers: { 'content-type': 'application/json' },
        body: JSON.stringify(heaviestLaunch),
      });
      await res.arrayBuffer();
      statuses.set(res.status, (statuses.get(res.status) ?? 0) + 1);
      if (res.status === 503) await new Promise((r) => setTimeout(r, 200));
    }
  };
  const launchers = Array.from({ length: 8 }, launcher);
  await new Promise((r) => setTimeout(r, 1000));
  const result = await autocannon({
    url: `${base}/api/v1/health`,
    connections: CONNECTIONS,
    duration: Math.max(DURATION_S, 8),
  });
  stop = true;
  await Promise.all(launchers);
  return { result, statuses };
}
process.stdout.write('  batch Match against single Matches…\n');
const batch = await benchBatchMatch(ports.product);
process.stdout.write('  /health while the calculators are saturated…\n');
const saturated = await healthUnderLoad();
servers.disconnect();

const bareGet = rows[0]!.rps;
const barePost = rows[3]!.rps;
console.log(`\nautocannon, ${CONNECTIONS} connections, ${DURATION_S} s each, loopback\n`);
console.log(
  'case                                   req/s    p50 ms   p99 ms   errors   ratio to bare',
);
for (const [i, r] of rows.entries()) {
  const bare = i < 3 ? bareGet : barePost;
  console.log(
    `${r.name.padEnd(36)} ${r.rps.toFixed(0).padStart(8)} ${r.p50.toFixed(1).padStart(9)} ${r.p99.toFixed(1).padStart(8)} ${String(r.errors).padStart(8)}   ${(r.rps / bare).toFixed(2)}`,
  );
}
console.log(
  '\nTargets (quality.md): catalogue search ≥ 0.50 of bare with p99 ≤ 25 ms; calculators p99 ≤ 50 ms.',
);
const h = saturated.result;
console.log(
  `\n/health while 8 clients keep the calculators saturated with the heaviest launches:` +
    `\n  ${h.requests.average.toFixed(0)} req/s, p50 ${h.latency.p50.toFixed(1)} ms, p99 ${h.latency.p99.toFixed(1)} ms, ` +
    `max ${h.latency.max.toFixed(1)} ms, errors ${h.errors + h.non2xx}` +
    `\n  launch answers: ${[...saturated.statuses].map(([s, n]) => `${n} × ${s}`).join(', ')}` +
    `\n  (aim, issue 8: p99 under 50 ms)`,
);

printBatchBench(batch);

const js = initialJavaScript();
console.log(
  js
    ? `\nInitial JavaScript of the front end: ${js.files.length} files, ${js.rawKb.toFixed(0)} kB, ` +
        `${js.gzipKb.toFixed(1)} kB gzip (budget ${INITIAL_JS_BUDGET_KB} kB gzip)`
    : '\nInitial JavaScript: no build in dist/client (run npm run build first)',
);

// BENCH_PHYSICS=0 skips the engine's comparison with SciPy (about a minute).
if (process.env.BENCH_PHYSICS !== '0') benchPhysics();

// BENCH_SORT_PLAN=0 skips the Sort Planner's Monte Carlo plan against its naive cost.
if (process.env.BENCH_SORT_PLAN !== '0') await benchSortPlan();
