/**
 * A background job kind. Each lives in `src/worker/jobs/<name>.ts` as
 * `export const job: JobDefinition<Data> = { queue: '<name>', handler: async (jobs) => … }`
 * and is listed in `src/worker/registry.ts`.
 */
import type { Job, QueueOptions } from '@/db/jobs';

export type { Job };

export interface JobDefinition<Data extends object = object> {
  /** Queue name (letters, digits, dashes). */
  queue: string;
  /** Receives an ARRAY of jobs (pg-boss 10). Throwing fails every job of the batch (retried per queue options). */
  handler: (jobs: Job<Data>[]) => Promise<unknown>;
  /** Concurrent pollers of this queue in one worker process. Default WORKER_CONCURRENCY (else 1). */
  teamSize?: number;
  /** Jobs fetched per handler call. Default 1. */
  batchSize?: number;
  /** Seconds between polls when the queue is empty (pg-boss minimum 0.5). Default 2. */
  pollingIntervalSeconds?: number;
  /** Queue options given to createQueue (retryLimit, expireInSeconds, policy, …). */
  queueOptions?: QueueOptions;
}
