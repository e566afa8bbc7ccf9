/**
 * Serving job definitions with pg-boss: one `createQueue` and `teamSize` `work()` pollers per
 * definition. Separate from main.ts so tests can serve their own test-only queues.
 */
import { ensureQueue, getBoss, stopBoss } from '@/db/jobs';
import { settings } from '@/src/settings';
import type { JobDefinition } from './types';

export interface WorkerHandle {
  queues: string[];
  stop(timeoutMs?: number): Promise<void>;
}

export async function serveJobs(
  definitions: JobDefinition<any>[], // eslint-disable-line @typescript-eslint/no-explicit-any
  log: (line: string) => void = (l) => console.log(l),
): Promise<WorkerHandle> {
  const seen = new Set<string>();
  for (const d of definitions) {
    if (seen.has(d.queue)) throw new Error(`worker registry lists queue "${d.queue}" twice`);
    seen.add(d.queue);
  }
  const boss = await getBoss({ supervise: true });
  for (const def of definitions) {
    await ensureQueue(def.queue, def.queueOptions);
    const team = def.teamSize ?? settings().WORKER_CONCURRENCY;
    for (let i = 0; i < team; i++) {
      await boss.work(
        def.queue,
        { batchSize: def.batchSize ?? 1, pollingIntervalSeconds: def.pollingIntervalSeconds ?? 2 },
        async (batch) => {
          const started = Date.now();
          log(`[worker] ${def.queue}: start ${batch.map((j) => j.id).join(', ')}`);
          try {
            const out = await def.handler(batch);
            log(`[worker] ${def.queue}: done in ${Date.now() - started} ms`);
            return out;
          } catch (err) {
            log(`[worker] ${def.queue}: failed — ${err instanceof Error ? err.message : String(err)}`);
            throw err;
          }
        },
      );
    }
    log(`[worker] serving "${def.queue}" with ${team} poller(s)`);
  }
  return {
    queues: [...seen],
    stop: (timeoutMs = 30_000) => stopBoss(timeoutMs),
  };
}
