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
