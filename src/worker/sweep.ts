/**
 * Crash recovery for runs. A worker process sweeps when it starts and then every
 * CAVITAS_RUN_SWEEP_S seconds (default 30): every chunk of a run that goes on whose holder's
 * heartbeat lease has lapsed gets its job again (another worker takes it over), and every run
 * without chunks still marked running or queued whose
 * heartbeat lease (CAVITAS_RUN_LEASE_S, default 30 s) has lapsed and that has no pending job
 * gets one continuation job. The continuation claims the run (the lease has passed), skips
 * the intervals already stored and solves the rest — so a killed worker costs about one lease
 * plus one sweep period instead of waiting for pg-boss to expire the dead job.
 *
 * Idempotent: the check and the send happen under one advisory lock (db/repo/runs.ts
 * `sweepLapsedRuns`), so at most one continuation per run is ever pending, however many
 * workers sweep.
 */
import { BOSS_SCHEMA } from '@/db/jobs';
import { sweepLapsedRuns } from '@/db/repo/runs';
import { enqueueChunk, enqueueRun, RUN_QUEUE } from '@/src/runs/queues';
import { PHASE } from '@/src/runs/lifecycle';
import { settings } from '@/src/settings';

export interface SweepOutcome {
  continued: string[];
  cancelled: string[];
  /** Chunks whose holder's lease lapsed (or that lost their job), queued again. */
  chunks: { runId: string; first: number }[];
}

/** One sweep: queues a continuation for each lapsed run without a pending job. */
export async function sweepRuns(leaseSeconds = settings().CAVITAS_RUN_LEASE_S): Promise<SweepOutcome> {
  return sweepLapsedRuns(leaseSeconds, RUN_QUEUE, enqueueRun, enqueueChunk, PHASE.cancelledWorkerGone, BOSS_SCHEMA);
}

export interface SweepHandle {
  stop(): Promise<void>;
}

/** Sweeps now and every `everySeconds`; a failed sweep is logged and tried again next time. */
export function startRunSweep(
  log: (line: string) => void = (l) => console.log(l),
  everySeconds = settings().CAVITAS_RUN_SWEEP_S,
): SweepHandle {
  let running: Promise<void> = Promise.resolve();
  let stopped = false;
  const once = () => {
    running = sweepRuns().then(
      (r) => {
        for (const id of r.continued) log(`[worker] sweep: run ${id} had no live worker; queued a continuation`);
        for (const c of r.chunks) log(`[worker] sweep: chunk ${c.first} of run ${c.runId} had no live worker; queued it again`);
        for (const id of r.cancelled)
          log(`[worker] sweep: run ${id} had no live worker and a cancel request; ended as cancelled`);
      },
      (err: unknown) => log(`[worker] sweep failed: ${err instanceof Error ? err.message : String(err)}`),
    );
  };
  once();
  const timer = setInterval(() => {
    if (!stopped) running.then(once);
  }, everySeconds * 1000);
  timer.unref();
  return {
    async stop() {
      stopped = true;
      clearInterval(timer);
      await running;
    },
  };
}
