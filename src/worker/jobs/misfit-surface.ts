/**
 * Computes a requested misfit surface of a run and caches it on its row
 * (src/runs/surface-compute.ts); a failure is stored on the row with its reason.
 */
import type { JobDefinition } from '../types';
import { computeSurface } from '@/src/runs/surface-compute';
import { SURFACE_JOB_OPTIONS, SURFACE_QUEUE } from '@/src/runs/queues';

export const job: JobDefinition<{ surfaceId: string }> = {
  queue: SURFACE_QUEUE,
  handler: async (jobs) => {
    const out: string[] = [];
    for (const j of jobs) out.push(await computeSurface(j.data.surfaceId));
    return out;
  },
  queueOptions: {
    retryLimit: SURFACE_JOB_OPTIONS.retryLimit,
    retryDelay: SURFACE_JOB_OPTIONS.retryDelay,
    expireInSeconds: SURFACE_JOB_OPTIONS.expireInSeconds,
  },
};
