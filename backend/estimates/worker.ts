/**
 * Piscina's worker entry. Before starting, it stamps the task's start time into the shared cell
 * the pool watches, so that the pool's watchdog measures the compute limit from the moment work
 * begins, not from when the request joined the queue.
 */
import { runEstimateJob, type EstimateJob, type EstimateOutcome } from './jobs';

export default function run(task: { job: EstimateJob; started: Float64Array }): EstimateOutcome {
  task.started[0] = Date.now();
  return runEstimateJob(task.job);
}
