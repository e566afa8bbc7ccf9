/**
 * Runs inversions. A job works one chunk of a run (a few intervals, `first` in its data) while
 * other jobs, on this worker or others, work the other chunks; the job that finishes the last
 * chunk ends the run. A crashed attempt is retried by pg-boss with the same data, and the retry
 * skips the intervals already stored; the crash sweep takes a chunk over sooner, once its
 * heartbeat lease has passed. A job whose chunk another worker holds alive fails, so pg-boss
 * retries it after a backoff longer than the lease.
 *
 * A job without `first` works a whole run launched before chunks existed, for a time slice
 * (default 5 minutes, CAVITAS_RUN_SLICE_S), then queues a continuation: such a run is held by
 * one worker at a time through its heartbeat.
 */
import { hostname } from 'node:os';
import type { JobDefinition } from '../types';
import { getRunById } from '@/db/repo/runs';
import { chunkHeldElsewhere } from '@/db/repo/run-chunks';
import { executeRun } from '@/src/runs/execute';
import { engineSolver } from '@/src/runs/solver';
import { enqueueChunk, enqueueRun, RUN_JOB_OPTIONS, RUN_QUEUE, type RunJobData } from '@/src/runs/queues';
import { settings } from '@/src/settings';

let handingOver = false;
/**
 * The worker is shutting down: every run in hand is handed back after the interval it is
 * solving (and a continuation queued), instead of working to the end of its time slice.
 */
export function handOverRuns(): void {
  handingOver = true;
}

function sliceMs(): number {
  return settings().CAVITAS_RUN_SLICE_S * 1000;
}

export const job: JobDefinition<RunJobData> = {
  queue: RUN_QUEUE,
  handler: async (jobs) => {
    const out: string[] = [];
    for (const j of jobs) {
      const { runId, first } = j.data;
      const lease = settings().CAVITAS_RUN_LEASE_S;
      const outcome = await executeRun(runId, {
        solve: engineSolver,
        workerId: `${hostname()}:${process.pid}:${j.id}`,
        budgetMs: first === undefined ? sliceMs() : undefined,
        leaseSeconds: lease,
        yieldNow: () => handingOver,
        writeEveryMs: settings().CAVITAS_RUN_WRITE_MS,
        chunk: first,
      });
      if (outcome === 'yielded') await (first === undefined ? enqueueRun(runId) : enqueueChunk(runId, first));
      if (outcome === 'not-runnable') {
        // Held by a heartbeat: either a live worker (then these retries run out harmlessly) or
        // an attempt that just died (then a retry after the lease has passed takes it over).
        const held =
          first === undefined ? (await getRunById(runId))?.state === 'running' : await chunkHeldElsewhere(runId, first, lease);
        if (held) throw new Error(`run ${runId} is held by another worker's heartbeat; retrying later`);
      }
      out.push(outcome);
    }
    return out;
  },
  // Chunks take a second or more each: poll often, so that a worker never idles between them.
  pollingIntervalSeconds: 0.5,
  queueOptions: {
    retryLimit: RUN_JOB_OPTIONS.retryLimit,
    retryDelay: RUN_JOB_OPTIONS.retryDelay,
    expireInSeconds: RUN_JOB_OPTIONS.expireInSeconds,
  },
};
