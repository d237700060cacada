import os from 'node:os';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { Piscina } from 'piscina';
import { ProblemError } from '../http/problem';
import type { ChecksJob, EstimateOutcome, LaunchJob, SensorJob, SortPlanJob } from './jobs';

export interface EstimatePoolOptions {
  /** Worker threads; by default one core is left to the event loop. */
  threads?: number;
  /** Jobs that may wait for a thread; beyond that a request gets 503 with Retry-After. */
  maxQueue?: number;
  /** Wall-clock budget of one calculation, counted from when a thread starts it. */
  computeLimitMs?: number;
}

export const DEFAULT_COMPUTE_LIMIT_MS = 5000;
/**
 * The engine checks' own limit. Their inputs are fixed, not a caller's, and they take a few
 * hundred milliseconds (measured: 0.2 s on one core); a deployment's tight limit for callers'
 * calculations must not make them fail, and a thread stuck for this long is still stopped.
 */
export const CHECKS_COMPUTE_LIMIT_MS = 20_000;
/** Time a thread gets past the limit to notice its own deadline before it is stopped. */
const GRACE_MS = 500;
const WATCH_EVERY_MS = 100;

function workerFile(): { filename: string; execArgv: string[] } {
  const here = path.dirname(fileURLToPath(import.meta.url));
  const compiled = path.join(here, 'worker.js');
  const source = path.join(here, 'worker.ts');
  // The product runs TypeScript through tsx (`node --import tsx`); threads need the same loader,
  // which they do not inherit from test runners that load TypeScript their own way.
  const hasTsx = process.execArgv.some((a) => a.includes('tsx'));
  return import.meta.url.endsWith('.ts')
    ? { filename: source, execArgv: hasTsx ? process.execArgv : ['--import', 'tsx'] }
    : { filename: compiled, execArgv: process.execArgv };
}

export interface EstimatePool {
  readonly computeLimitMs: number;
  /** Runs a job on a worker thread; resolves with the response body or throws a ProblemError. */
  run(job: SensorJob | LaunchJob | ChecksJob | SortPlanJob): Promise<unknown>;
  /** Threads busy and jobs waiting, for the health check and the bench. */
  load(): { running: number; queued: number; threads: number };
  close(): Promise<void>;
}

/**
 * The calculators' worker pool. A launch can take seconds of CPU; on the event loop it held up
 * every other request (three at once kept /health waiting 17 s). Here the loop only waits, the
 * queue is bounded, and a job that overruns its limit has its thread stopped.
 */
export function createEstimatePool(options: EstimatePoolOptions = {}): EstimatePool {
  const threads = options.threads ?? Math.max(1, os.availableParallelism() - 1);
  const computeLimitMs = options.computeLimitMs ?? DEFAULT_COMPUTE_LIMIT_MS;
  const maxQueue = options.maxQueue ?? threads * 4;
  let piscina: Piscina | undefined;
  const running = new Set<{ started: Float64Array; abort: AbortController; limitMs: number }>();
  let watchdog: NodeJS.Timeout | undefined;

  // Started on first use: most processes that build the app (tests, the CLI) never estimate.
  const pool = () => {
    if (!piscina) {
      piscina = new Piscina({
        ...workerFile(),
        // Every thread stays up: a stopped thread must be replaced before queued jobs can run
        // (with fewer threads kept than allowed, piscina 5.3 leaves the queue waiting forever).
        minThreads: threads,
        maxThreads: threads,
        maxQueue,
      });
      watchdog = setInterval(() => {
        const now = Date.now();
        for (const task of running) {
          const started = task.started[0]!;
          if (started > 0 && now - started > task.limitMs + GRACE_MS) task.abort.abort();
        }
      }, WATCH_EVERY_MS);
      watchdog.unref();
    }
    return piscina;
  };

  const tooSlow = (job: { kind: string }) =>
    job.kind === 'checks'
      ? // Nothing the caller sent made it slow: the server is overloaded, so "try later".
        new ProblemError(
          503,
          'Service unavailable',
          'The engine checks did not finish in time: try again shortly.',
          undefined,
          { 'Retry-After': String(Math.ceil(computeLimitMs / 1000)) },
        )
      : new ProblemError(
          422,
          'Unprocessable content',
          `The calculation needs more than the ${computeLimitMs / 1000} s this service allows: ask for fewer points, filaments or layers.`,
        );

  return {
    computeLimitMs,
    async run(job) {
      const p = pool();
      if (p.queueSize >= maxQueue) throw busy(computeLimitMs);
      const limitMs =
        job.kind === 'checks' ? Math.max(computeLimitMs, CHECKS_COMPUTE_LIMIT_MS) : computeLimitMs;
      const task = {
        started: new Float64Array(new SharedArrayBuffer(Float64Array.BYTES_PER_ELEMENT)),
        abort: new AbortController(),
        limitMs,
      };
      running.add(task);
      try {
        const outcome = (await p.run(
          { job: { ...job, computeLimitMs: limitMs }, started: task.started },
          { signal: task.abort.signal },
        )) as EstimateOutcome;
        if (outcome.ok) return outcome.value;
        if (outcome.kind === 'too-slow') throw tooSlow(job);
        throw new ProblemError(422, 'Unprocessable content', outcome.message, [
          { path: outcome.field, message: outcome.message },
        ]);
      } catch (error) {
        if (task.abort.signal.aborted) throw tooSlow(job);
        if (error instanceof Error && /queue is at limit/i.test(error.message))
          throw busy(computeLimitMs);
        throw error;
      } finally {
        running.delete(task);
      }
    },
    load() {
      return {
        running: running.size - (piscina?.queueSize ?? 0),
        queued: piscina?.queueSize ?? 0,
        threads,
      };
    },
    async close() {
      if (watchdog) clearInterval(watchdog);
      await piscina?.close({ force: true });
      piscina = undefined;
    },
  };
}

function busy(computeLimitMs: number): ProblemError {
  return new ProblemError(
    503,
    'Service unavailable',
    'Every calculator is busy and the queue is full: try again shortly.',
    undefined,
    { 'Retry-After': String(Math.ceil(computeLimitMs / 1000)) },
  );
}
