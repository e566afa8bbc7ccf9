/**
 * A run's work in chunks: at launch the run's intervals are cut into chunks of
 * CAVITAS_RUN_CHUNK consecutive intervals, one job each (src/runs/queues.ts), so that any
 * number of worker processes on any number of machines share one run. What each chunk does is
 * in src/runs/execute.ts (the driver with `chunk`); the rules that keep the results exactly once
 * per interval and end the run exactly once are in db/repo/run-chunks.ts.
 */
import { createRunChunks, liveWorkers } from '@/db/repo/run-chunks';
import { settings } from '@/src/settings';

/** Cuts a new run into chunks (before its jobs are queued). */
export async function splitRun(runId: string, intervals: number): Promise<void> {
  await createRunChunks(runId, intervals, settings().CAVITAS_RUN_CHUNK);
}

/** Workers on the run now: those whose heartbeat on it is within the lease. */
export function workersOnRun(runId: string): Promise<number> {
  return liveWorkers(runId, settings().CAVITAS_RUN_LEASE_S);
}
