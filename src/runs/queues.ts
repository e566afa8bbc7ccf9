/**
 * Queue names and job options of the run jobs, and the one way to queue each: a run's work (at
 * launch, re-run, and the crash sweep), one chunk of a run (hand-back and the sweep), and a
 * misfit surface. A run is worked in chunks of a few intervals (src/runs/chunks.ts), one job
 * per chunk, so that every worker on every machine can take a share of it; runs launched before
 * chunks existed are worked whole by one job at a time. A job is retried with the same data
 * after a crash (the driver resumes from the stored intervals); an attempt that stops
 * reporting expires and is retried.
 */
import { enqueue, enqueueMany } from '@/db/jobs';
import { hasChunks, undoneChunks } from '@/db/repo/run-chunks';

export const RUN_QUEUE = 'run-inversion';
export const SURFACE_QUEUE = 'misfit-surface';

/** What a run job works: a chunk (`first`: the index of its first interval) or, without one, the whole run. */
export interface RunJobData {
  runId: string;
  first?: number;
}

/** A job works at most one time slice (5 min by default), so 20 minutes without finishing means it died. */
export const RUN_JOB_OPTIONS = { retryLimit: 8, retryDelay: 10, retryBackoff: true, expireInSeconds: 20 * 60 };
export const SURFACE_JOB_OPTIONS = { retryLimit: 2, retryDelay: 5, expireInSeconds: 1800 };

/** Queues a job that works the whole run (from where its stored intervals end): runs without chunks. */
export async function enqueueRun(runId: string): Promise<void> {
  await enqueue(RUN_QUEUE, { runId } satisfies RunJobData, RUN_JOB_OPTIONS);
}

/** Queues a job that works one chunk of a run. */
export async function enqueueChunk(runId: string, first: number): Promise<void> {
  await enqueue(RUN_QUEUE, { runId, first } satisfies RunJobData, RUN_JOB_OPTIONS);
}

/**
 * Queues what is left of a run: one job per chunk not done (their holders cleared: used when
 * nothing works on the run, at launch and re-run), or one whole-run job for a run without chunks.
 */
export async function enqueueRunWork(runId: string): Promise<void> {
  if (!(await hasChunks(runId))) return enqueueRun(runId);
  const firsts = await undoneChunks(runId, true);
  await enqueueMany(
    RUN_QUEUE,
    firsts.map((first): RunJobData => ({ runId, first })),
    RUN_JOB_OPTIONS,
  );
}

/** Queues a job that computes a misfit surface. */
export async function enqueueSurface(surfaceId: string): Promise<void> {
  await enqueue(SURFACE_QUEUE, { surfaceId }, SURFACE_JOB_OPTIONS);
}
