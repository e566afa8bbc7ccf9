/**
 * Queue names and job options of the run jobs, and the one way to queue each: a run (at
 * launch, re-run, hand-back after a time slice, and the crash sweep) and a misfit surface.
 * A run job is retried with the same run id after a crash (the driver resumes from the stored
 * intervals); an attempt that stops reporting expires and is retried.
 */
import { enqueue } from '@/db/jobs';

export const RUN_QUEUE = 'run-inversion';
export const SURFACE_QUEUE = 'misfit-surface';

/** A job works at most one time slice (5 min by default), so 20 minutes without finishing means it died. */
export const RUN_JOB_OPTIONS = { retryLimit: 8, retryDelay: 10, retryBackoff: true, expireInSeconds: 20 * 60 };
export const SURFACE_JOB_OPTIONS = { retryLimit: 2, retryDelay: 5, expireInSeconds: 1800 };

/** Queues a job that works the run (from where its stored intervals end). */
export async function enqueueRun(runId: string): Promise<void> {
  await enqueue(RUN_QUEUE, { runId }, RUN_JOB_OPTIONS);
}

/** Queues a job that computes a misfit surface. */
export async function enqueueSurface(surfaceId: string): Promise<void> {
  await enqueue(SURFACE_QUEUE, { surfaceId }, SURFACE_JOB_OPTIONS);
}
