/**
 * A shared worker-thread pool (piscina) for multi-start runs. The pool is kept
 * between runs (an interval series reuses it) and closed by
 * closeInversionPool().
 */
import { Piscina } from 'piscina';
import type { PoolTask } from './pool-worker';
import type { StartOutcome } from '../descents';

/**
 * Run from TypeScript sources (tests, `npx tsx`), each thread loads them through pool-bootstrap.mjs; in the
 * compiled programs (src/ops/launch.mjs) the thread entry `inversion-thread.js` sits beside this module's bundle.
 */
function workerFile(): string {
  const fromSource = import.meta.url.endsWith('.ts');
  return new URL(fromSource ? './pool-bootstrap.mjs' : './inversion-thread.js', import.meta.url).href;
}

let pool: Piscina | null = null;
let poolThreads = 0;

export function inversionPool(threads: number): Piscina {
  if (pool && poolThreads === threads) return pool;
  if (pool) void pool.destroy();
  pool = new Piscina({
    filename: workerFile(),
    minThreads: threads,
    maxThreads: threads,
    idleTimeout: 60_000,
    // two tasks per worker: the next one is already waiting in the worker when one finishes
    concurrentTasksPerWorker: 2,
  });
  poolThreads = threads;
  return pool;
}

export function runPoolTask(threads: number, task: PoolTask): Promise<StartOutcome[]> {
  return inversionPool(threads).run(task) as Promise<StartOutcome[]>;
}

export async function closeInversionPool(): Promise<void> {
  const p = pool;
  pool = null;
  poolThreads = 0;
  if (p) await p.destroy();
}
