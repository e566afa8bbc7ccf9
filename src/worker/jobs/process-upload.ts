/**
 * Background processing of uploaded station files. The upload row carries the
 * state, progress and failure reason; a failed upload is queued again by a
 * person ("Process again"), so pg-boss does not retry by itself.
 */
import type { JobDefinition } from '../types';
import { processUpload } from '@/src/data/process-upload';
import { PROCESS_UPLOAD_QUEUE } from '@/src/data/intake';

export const job: JobDefinition<{ uploadId: string }> = {
  queue: PROCESS_UPLOAD_QUEUE,
  handler: async (jobs) => {
    const out: string[] = [];
    for (const j of jobs) out.push(await processUpload(j.data.uploadId));
    return out;
  },
  queueOptions: { retryLimit: 0, expireInSeconds: 3600 },
};
