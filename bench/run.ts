/**
 * `npm run bench`: catalogue search, a filtered list and Match, each beside bare Express and bare
 * node:http answering the product's own bytes for that case (bench/servers.ts), with autocannon
 * on loopback in the same run; prints throughput, p50/p99 latency, the ratios, the product at 100
 * connections for 30 s, and the servers' peak RSS; then a batch Match of 10,000 readings against
 * as many single Matches, and a sort plan against its naive cost. Ratios travel between machines;
 * absolute numbers do not. No assertion: a report.
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
import { productCases, type BenchPorts, type ProductCase } from './cases';

const DURATION_S = Number(process.env.BENCH_SECONDS ?? 5);
/**
 * Each side-by-side figure is the sum of this many short runs taken in turn (bare Express, the
 * product, bare Express…): a shared machine's speed drifts by tens of percent over a minute, and
 * taking the two in alternation keeps that drift out of their ratio.
 */
const ROUNDS = Number(process.env.BENCH_ROUNDS ?? 6);
const CONNECTIONS = 10;
/** The overload check: many connections for a long while, counting errors (issue 13: 0 in 30 s). */
const MANY_CONNECTIONS = 100;
const LONG_S = Number(process.env.BENCH_LONG_SECONDS ?? 30);

const servers = fork(path.join(projectRoot, 'bench', 'servers.ts'), {
  execArgv: ['--import', 'tsx'],
  stdio: ['ignore', 'ignore', 'inherit', 'ipc'],
});
const ports = await new Promise<BenchPorts>((resolve) => servers.once('message', resolve as never));

interface Row {
  name: string;
  rps: number;
  p50: number;
  p99: number;
  errors: number;
}

async function load(
  name: string,
  port: number,
  c: ProductCase,
  urlPath: string,
  connections = CONNECTIONS,
  duration = DURATION_S,
): Promise<Row> {
  process.stdout.write(`  ${name}…\n`);
  const result = await autocannon({
    url: `http://127.0.0.1:${port}${urlPath}`,
    method: c.method,
    connections,
    duration,
    headers: c.body ? { 'content-type': 'application/json' } : {},
    body: c.body ? JSON.stringify(c.body) : undefined,
  });
  return {
    name,
    rps: result.requests.average,
    p50: result.latency.p50,
    p99: result.latency.p99,
    errors: result.errors + result.timeouts + result.non2xx,
  };
}

/** Several runs of one server and case, alternated with others by the caller, as one row. */
class Rounds {
  private requests = 0;
  private seconds = 0;
  private p99s: number[] = [];
  private p50s: number[] = [];
  private errors = 0;
  /** Each run's requests per second, in order: a round's ratio pairs it with the other server's. */
  readonly rates: number[] = [];
  constructor(readonly name: string) {}
  add(result: autocannon.Result) {
    this.rates.push(result.requests.total / result.duration);
    this.requests += result.requests.total;
    this.seconds += result.duration;
    this.p99s.push(result.latency.p99);
    this.p50s.push(result.latency.p50);
    this.errors += result.errors + result.timeouts + result.non2xx;
  }
  row(): Row {
    const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)]!;
    return {
      name: this.name,
      rps: this.requests / this.seconds,
      p50: median(this.p50s),
      p99: median(this.p99s),
      errors: this.errors,
    };
  }
}

async function once(port: number, c: ProductCase, urlPath: string, duration: number) {
  return autocannon({
    url: `http://127.0.0.1:${port}${urlPath}`,
    method: c.method,
    connections: CONNECTIONS,
    duration,
    headers: c.body ? { 'content-type': 'application/json' } : {},
    body: c.body ? JSON.stringify(c.body) : undefined,
  });
}

// Side by side in one run: each case on node:http, then bare Express and the product in turns.
const groups: Array<{
  c: ProductCase;
  node: Row;
  express: Row;
  product: Row;
  /** The product's rate over bare Express's in each round, lowest first. */
  roundRatios: number[];
}> = [];
const roundSeconds = Math.max(1, Math.round(DURATION_S / ROUNDS));
for (const c of productCases) {
  process.stdout.write(`  ${c.name}: node:http, then bare Express and the product in turns…\n`);
  const node = new Rounds('node:http');
  const bare = new Rounds('bare Express');
  const product = new Rounds(c.name);
  node.add(await once(ports.node, c, `/bare/${c.key}`, DURATION_S));
  // Warm both up (the JIT, the product's caches) before anything is counted.
  await once(ports.express, c, `/bare/${c.key}`, 1);
  await once(ports.product, c, c.path, 1);
  for (let i = 0; i < ROUNDS; i++) {
    bare.add(await once(ports.express, c, `/bare/${c.key}`, roundSeconds));
    product.add(await once(ports.product, c, c.path, roundSeconds));
  }
  const roundRatios = product.rates.map((r, i) => r / bare.rates[i]!).sort((a, b) => a - b);
  groups.push({ c, node: node.row(), express: bare.row(), product: product.row(), roundRatios });
}
const overload: Row[] = [];
for (const c of productCases.filter((x) => x.key !== 'filter'))
  overload.push(
    await load(
      `${c.name}, ${MANY_CONNECTIONS} connections`,
      ports.product,
      c,
      c.path,
      MANY_CONNECTIONS,
      LONG_S,
    ),
  );

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

const peakRssKb = await new Promise<number>((resolve) => {
  servers.once('message', (m: { peakRssKb: number }) => resolve(m.peakRssKb));
  servers.send('peak-rss');
});
servers.disconnect();

const row = (r: Row, ratios: string) =>
  `${r.name.padEnd(40)} ${r.rps.toFixed(0).padStart(8)} ${r.p50.toFixed(1).padStart(8)} ${r.p99.toFixed(1).padStart(8)} ${String(r.errors).padStart(7)}   ${ratios}`;
console.log(
  `\nautocannon, ${CONNECTIONS} connections, loopback, no compression asked; node:http ${DURATION_S} s, ` +
    `bare Express and the product ${ROUNDS} × ${roundSeconds} s each in turns; ` +
    'the product as NODE_ENV=production runs it (answers not re-validated against openapi.yaml)',
);
console.log(
  'case                                        req/s   p50 ms   p99 ms  errors   ratio to bare Express / to node:http',
);
for (const g of groups) {
  console.log(`${g.c.name} (${ports.bytes[g.c.key]} bytes)`);
  console.log(row({ ...g.node, name: '  node:http, same bytes' }, ''));
  console.log(
    row(
      { ...g.express, name: '  bare Express + compression, same bytes' },
      `1.00 / ${(g.express.rps / g.node.rps).toFixed(2)}`,
    ),
  );
  console.log(
    row(
      { ...g.product, name: '  the product' },
      `${(g.product.rps / g.express.rps).toFixed(2)} / ${(g.product.rps / g.node.rps).toFixed(2)}`,
    ),
  );
  const r = g.roundRatios;
  console.log(
    `  rounds: product / bare Express ${r.map((x) => x.toFixed(2)).join(' ')} ` +
      `(median ${r[Math.floor(r.length / 2)]!.toFixed(2)})`,
  );
}
console.log(`\nThe product with ${MANY_CONNECTIONS} connections for ${LONG_S} s:`);
for (const r of overload) console.log(row(r, ''));
console.log(
  `\nPeak RSS of the servers' process (all three servers): ${(peakRssKb / 1024).toFixed(0)} MB`,
);
console.log(
  '\nTargets (quality.md, issue 13): search and Match ≥ 0.50 of bare Express with p99 ≤ 25 ms at ' +
    `${CONNECTIONS} connections, 0 errors at ${MANY_CONNECTIONS}; calculators p99 ≤ 50 ms.`,
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
