/**
 * Runs inversions. Each job works on one run for a time slice (default 5
 * minutes, CAVITAS_RUN_SLICE_S), storing every finished interval at once, then
 * queues a continuation and returns — so a job never outlives its expiry, a
 * crashed attempt is retried by pg-boss with the same run id, and the retry
 * resumes after the last stored interval. Any number of workers may serve
 * this queue: a run is held by one worker at a time through its heartbeat; a
 * job that finds the run held fails, so pg-boss retries it after a backoff
 * longer than the heartbeat lease.
 */
import { hostname } from 'node:os';
import type { JobDefinition } from '../types';
import { getRunById } from '@/db/repo/runs';
import { executeRun } from '@/src/runs/execute';
import { engineSolver } from '@/src/runs/solver';
import { enqueueRun, RUN_JOB_OPTIONS, RUN_QUEUE } from '@/src/runs/queues';
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

export const job: JobDefinition<{ runId: string }> = {
  queue: RUN_QUEUE,
  handler: async (jobs) => {
    const out: string[] = [];
    for (const j of jobs) {
      const outcome = await executeRun(j.data.runId, {
        solve: engineSolver,
        workerId: `${hostname()}:${process.pid}:${j.id}`,
        budgetMs: sliceMs(),
        leaseSeconds: settings().CAVITAS_RUN_LEASE_S,
        yieldNow: () => handingOver,
        writeEveryMs: settings().CAVITAS_RUN_WRITE_MS,
      });
      if (outcome === 'yielded') await enqueueRun(j.data.runId);
      if (outcome === 'not-runnable' && (await getRunById(j.data.runId))?.state === 'running') {
        // Held by a heartbeat: either a live worker (then these retries run out harmlessly) or
        // an attempt that just died (then a retry after the lease has passed takes the run over).
        throw new Error(`run ${j.data.runId} is held by another worker's heartbeat; retrying later`);
      }
      out.push(outcome);
    }
    return out;
  },
  queueOptions: {
    retryLimit: RUN_JOB_OPTIONS.retryLimit,
    retryDelay: RUN_JOB_OPTIONS.retryDelay,
    expireInSeconds: RUN_JOB_OPTIONS.expireInSeconds,
  },
};
