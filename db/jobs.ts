/**
 * Background jobs on pg-boss 10, in the same database (own schema `pgboss`).
 *
 * - Web processes only send: `enqueue(queue, data)` starts a light client (no maintenance).
 * - The worker process (src/worker/main.ts) calls `getBoss({ supervise: true })` first, so
 *   it runs pg-boss's maintenance as well; any number of workers, on any machines, may point
 *   at the same DATABASE_URL — pg-boss hands each job to exactly one of them
 *   (SELECT … FOR UPDATE SKIP LOCKED).
 *
 * pg-boss 10 specifics: CommonJS default export; a queue must be created before `send`;
 * `work` handlers receive an ARRAY of jobs.
 */
import PgBoss from 'pg-boss';
import { settings } from '@/src/settings';

export type { PgBoss };
export type Job<T = object> = PgBoss.Job<T>;
export type SendOptions = PgBoss.SendOptions;
export type QueueOptions = Omit<PgBoss.Queue, 'name'>;

export const BOSS_SCHEMA = 'pgboss';

interface BossState {
  boss: Promise<PgBoss> | null;
  queues: Set<string>;
}

// Kept on globalThis so Next.js hot reloads do not open a second client.
const state: BossState = ((globalThis as Record<string, unknown>).__cavitasBoss as BossState | undefined) ?? {
  boss: null,
  queues: new Set<string>(),
};
(globalThis as Record<string, unknown>).__cavitasBoss = state;

export interface BossOptions {
  /** Run pg-boss maintenance and cron scheduling here (worker processes). Default false. */
  supervise?: boolean;
  /** Connection pool size. Default 4. */
  max?: number;
}

/** The started pg-boss instance of this process (created on first call). */
export function getBoss(options: BossOptions = {}): Promise<PgBoss> {
  if (!state.boss) {
    const connectionString = settings().DATABASE_URL;
    if (!connectionString) return Promise.reject(new Error('DATABASE_URL is not set: cannot reach the job queue'));
    const boss = new PgBoss({
      connectionString,
      schema: BOSS_SCHEMA,
      max: options.max ?? 4,
      application_name: options.supervise ? 'cavitas-worker' : 'cavitas-app',
      supervise: options.supervise ?? false,
      schedule: options.supervise ?? false,
      migrate: true,
    });
    boss.on('error', (err) => console.error(`[jobs] ${err.message}`));
    state.boss = boss.start().catch((err: unknown) => {
      state.boss = null;
      throw err;
    });
  }
  return state.boss;
}

/** Creates the queue if this process has not done so yet (idempotent in pg-boss too). */
export async function ensureQueue(queue: string, options: QueueOptions = {}): Promise<void> {
  if (state.queues.has(queue)) return;
  const boss = await getBoss();
  await boss.createQueue(queue, { name: queue, ...options });
  state.queues.add(queue);
}

/** Sends one job; returns its id. Throws when pg-boss declines it (e.g. a singleton already queued). */
export async function enqueue<T extends object>(queue: string, data: T, options: SendOptions = {}): Promise<string> {
  await ensureQueue(queue);
  const boss = await getBoss();
  const id = await boss.send(queue, data, options);
  if (!id) throw new Error(`job not queued on "${queue}" (a matching singleton job is already waiting)`);
  return id;
}

/** Sends one job per item of `data` to one queue, in one statement (e.g. the chunks of a run). */
export async function enqueueMany<T extends object>(
  queue: string,
  data: T[],
  options: Omit<PgBoss.JobInsert, 'name' | 'data' | 'id'> = {},
): Promise<void> {
  if (data.length === 0) return;
  await ensureQueue(queue);
  const boss = await getBoss();
  await boss.insert(data.map((d) => ({ ...options, name: queue, data: d })));
}

/** Cancels a queued or running job (a running handler is not interrupted; see its own checks). */
export async function cancelJob(queue: string, id: string): Promise<void> {
  const boss = await getBoss();
  await boss.cancel(queue, id);
}

/** Stops this process's pg-boss (waiting up to `timeoutMs` for running handlers). */
export async function stopBoss(timeoutMs = 30_000): Promise<void> {
  const pending = state.boss;
  state.boss = null;
  state.queues.clear();
  if (!pending) return;
  const boss = await pending.catch(() => null);
  if (boss) await boss.stop({ graceful: true, wait: true, timeout: timeoutMs });
}
