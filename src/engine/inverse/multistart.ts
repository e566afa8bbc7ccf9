/**
 * Multi-start driver: runs LM from `starts` reproducible start points (warm
 * starts first, then the seeded quasi-random sequence) in the calling thread
 * (threads = 1) or on the worker pool, with progress and cancellation
 * callbacks. Outcomes come back ordered by start index, so grouping does not
 * depend on the thread count or on scheduling.
 */
import { availableParallelism } from 'node:os';
import type { LeastSquaresProblem, LmOptions } from '@/src/engine/optim/types';
import { INVERSION_LM_MISFIT_TOL, INVERSION_LM_STEP_TOL } from '@/src/engine/tolerances';
import { InversionInputError } from './errors';
import { runPoolTask } from './pool';
import type { ProblemRecipe } from './recipes';
import { runStarts, type StartOutcome, type StartPlan } from './run-starts';
import type { InversionCallbacks } from './types';

export interface MultiStartOptions {
  /** Number of starts (default 64). */
  starts: number;
  /** Seed of the quasi-random start sequence (default 1). */
  seed: number;
  /** Worker threads; 1 runs in the calling thread (default: all cores). */
  threads: number;
  /** Explicit start points (internal units) used for the first indexes. */
  warm: number[][];
  /** Options of each LM run (default: looser misfit and step tolerances than the optimiser's own). */
  lm: Partial<LmOptions>;
  /** Scale standard errors by the reduced chi-square (default false: sigmas are trusted). */
  scaleErrors: boolean;
  /**
   * With threads > 1, the calling thread computes starts too (default true). Set false to keep
   * the caller's event loop free (a server process): all starts then go to `threads` workers.
   */
  callerWorks: boolean;
}

export function resolveMultiStartOptions(o: Partial<MultiStartOptions> = {}): MultiStartOptions {
  const r: MultiStartOptions = {
    starts: o.starts ?? 64,
    seed: o.seed ?? 1,
    threads: o.threads ?? availableParallelism(),
    warm: o.warm ?? [],
    lm: { misfitTol: INVERSION_LM_MISFIT_TOL, stepTol: INVERSION_LM_STEP_TOL, ...o.lm },
    scaleErrors: o.scaleErrors ?? false,
    callerWorks: o.callerWorks ?? true,
  };
  if (!Number.isInteger(r.starts) || r.starts < 1)
    throw new InversionInputError(`starts must be a whole number >= 1, got ${r.starts}`);
  if (!Number.isInteger(r.seed) || r.seed < 0) throw new InversionInputError(`seed must be a whole number >= 0, got ${r.seed}`);
  if (!Number.isInteger(r.threads) || r.threads < 1)
    throw new InversionInputError(`threads must be a whole number >= 1, got ${r.threads}`);
  if (r.warm.length > r.starts) r.warm = r.warm.slice(0, r.starts);
  return r;
}

let runCounter = 0;
/** How often (ms) the caller asks shouldCancel while it waits for pool workers. */
const CANCEL_POLL_MS = 50;

export async function multiStart(
  recipe: ProblemRecipe,
  problem: LeastSquaresProblem,
  options: MultiStartOptions,
  callbacks: InversionCallbacks = {},
): Promise<StartOutcome[]> {
  const total = options.starts;
  const plan: StartPlan = { seed: options.seed, warm: options.warm, lm: options.lm };
  let done = 0;
  let bestMisfit = Infinity;
  const note = (o: StartOutcome) => {
    done++;
    if (o.chi2 < bestMisfit) bestMisfit = o.chi2;
    callbacks.onProgress?.({ done, total, bestMisfit });
  };
  const indexes = Array.from({ length: total }, (_, i) => i);
  if (options.threads === 1) {
    return runStarts(problem, indexes, plan, callbacks.shouldCancel, note);
  }
  // threads > 1: the calling thread and the pool workers take start indexes from one shared
  // counter (Atomics.add), so no start is computed twice and a slow thread simply claims fewer.
  // A pool task claims up to `chunk` starts and returns their outcomes; each worker is kept two
  // tasks deep so that it never waits for the (busy) calling thread to hand it the next one.
  const cancel = new SharedArrayBuffer(4);
  const flag = new Int32Array(cancel);
  const claim = new SharedArrayBuffer(4);
  const next = new Int32Array(claim);
  const key = `${process.pid}:${++runCounter}`;
  const workers = options.callerWorks ? options.threads - 1 : options.threads;
  const chunk = Math.max(1, Math.ceil(total / (options.threads * 8)));
  const have = new Map<number, StartOutcome>();
  const cancelled = () => {
    if (callbacks.shouldCancel?.()) Atomics.store(flag, 0, 1);
    return Atomics.load(flag, 0) !== 0;
  };
  const keep = (o: StartOutcome) => {
    if (have.has(o.index)) return;
    have.set(o.index, o);
    note(o);
    cancelled(); // the workers see a cancellation through the shared flag, even when the caller computes nothing
  };
  const inFlight = new Set<Promise<void>>();
  let failure: unknown = null;
  cancelled();
  const dispatch = () => {
    while (inFlight.size < 2 * workers && Atomics.load(next, 0) < total && failure === null) {
      const job: Promise<void> = runPoolTask(workers, { key, recipe, plan, total, chunk, claim, cancel })
        .then((res) => res.forEach(keep))
        .catch((e: unknown) => {
          failure ??= e;
        })
        .finally(() => {
          inFlight.delete(job);
          dispatch();
        });
      inFlight.add(job);
    }
  };
  dispatch();
  if (options.callerWorks) {
    while (failure === null) {
      const index = Atomics.add(next, 0, 1);
      if (index >= total) break;
      runStarts(problem, [index], plan, cancelled, keep);
      // yield so that finished pool tasks are collected and new ones dispatched promptly
      await new Promise<void>((resolve) => setImmediate(resolve));
    }
  }
  while (inFlight.size > 0 && failure === null) {
    // wake up now and then to ask shouldCancel while only the workers compute
    const tick = new Promise<void>((resolve) => setTimeout(resolve, CANCEL_POLL_MS));
    await Promise.race([...inFlight, tick]);
    cancelled();
  }
  if (failure !== null) {
    Atomics.store(flag, 0, 1);
    throw failure;
  }
  return [...have.values()].sort((a, b) => a.index - b.index);
}
