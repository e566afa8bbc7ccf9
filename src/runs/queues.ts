/**
 * Queue names and job options of the run jobs. A run job is retried with the
 * same run id after a crash (the driver resumes from the stored intervals);
 * an attempt that stops reporting expires and is retried.
 */
export const RUN_QUEUE = 'run-inversion';
export const SURFACE_QUEUE = 'misfit-surface';

/** A job works at most one time slice (5 min by default), so 20 minutes without finishing means it died. */
export const RUN_JOB_OPTIONS = { retryLimit: 8, retryDelay: 10, retryBackoff: true, expireInSeconds: 20 * 60 };
export const SURFACE_JOB_OPTIONS = { retryLimit: 2, retryDelay: 5, expireInSeconds: 1800 };

function positiveSeconds(raw: string | undefined, fallback: number): number {
  const s = Number(raw);
  return Number.isFinite(s) && s > 0 ? s : fallback;
}

/** Seconds without a heartbeat after which a run's worker counts as gone (CAVITAS_RUN_LEASE_S, default 30). */
export function runLeaseSeconds(env: Record<string, string | undefined> = process.env): number {
  return positiveSeconds(env.CAVITAS_RUN_LEASE_S, 30);
}

/** Seconds between the worker's sweeps for runs whose worker is gone (CAVITAS_RUN_SWEEP_S, default 30). */
export function runSweepSeconds(env: Record<string, string | undefined> = process.env): number {
  return positiveSeconds(env.CAVITAS_RUN_SWEEP_S, 30);
}

/**
 * Milliseconds between the driver's batched result writes (CAVITAS_RUN_WRITE_MS, default the
 * driver's own WRITE_EVERY_MS; 0 writes each interval at once): what a crash may cost in solving.
 */
export function runWriteMs(env: Record<string, string | undefined> = process.env): number | undefined {
  const raw = env.CAVITAS_RUN_WRITE_MS;
  if (raw === undefined || raw.trim() === '') return undefined;
  const ms = Number(raw);
  return Number.isFinite(ms) && ms >= 0 ? ms : undefined;
}
