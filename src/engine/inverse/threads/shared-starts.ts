/**
 * Starts shared out between the calling thread and the pool workers: all
 * take start indexes from one shared counter (Atomics.add), so no start is
 * computed twice and a slow thread simply claims fewer. A pool task claims up
 * to `chunk` starts and returns their outcomes; each worker is kept two tasks
 * deep so that it never waits for the (busy) calling thread to hand it the
 * next one. A cancellation reaches the workers through a shared flag.
 */
import type { LeastSquaresProblem } from '@/src/engine/optim/types';
import { runStarts, type StartOutcome, type StartPlan } from '../descents';
import { runPoolTask } from './pool';
import type { ProblemRef } from './problem-builders';

export interface SharedStartsRun {
  /** Names the problem in the pool workers' cache (newRunKey); calls with the same key share one build. */
  key?: string;
  problem: LeastSquaresProblem;
  ref: ProblemRef;
  plan: StartPlan;
  /** The start indexes to search. */
  indexes: number[];
  threads: number;
  /** The calling thread computes starts too. */
  callerWorks: boolean;
  shouldCancel?: () => boolean;
  /** Called once per finished start, in the calling thread. */
  onEach: (o: StartOutcome) => void;
}

let runCounter = 0;
export const newRunKey = () => `${process.pid}:${++runCounter}`;
/** How often (ms) the caller asks shouldCancel while it waits for pool workers. */
const CANCEL_POLL_MS = 50;

export async function sharedStarts(run: SharedStartsRun): Promise<StartOutcome[]> {
  const total = run.indexes.length;
  const cancel = new SharedArrayBuffer(4);
  const flag = new Int32Array(cancel);
  const claim = new SharedArrayBuffer(4);
  const next = new Int32Array(claim);
  const key = run.key ?? newRunKey();
  const workers = run.callerWorks ? run.threads - 1 : run.threads;
  const chunk = Math.max(1, Math.ceil(total / (run.threads * 8)));
  const have = new Map<number, StartOutcome>();
  const cancelled = () => {
    if (run.shouldCancel?.()) Atomics.store(flag, 0, 1);
    return Atomics.load(flag, 0) !== 0;
  };
  const keep = (o: StartOutcome) => {
    if (have.has(o.index)) return;
    have.set(o.index, o);
    run.onEach(o);
    cancelled(); // the workers see a cancellation through the shared flag, even when the caller computes nothing
  };
  const inFlight = new Set<Promise<void>>();
  let failure: unknown = null;
  cancelled();
  const dispatch = () => {
    while (inFlight.size < 2 * workers && Atomics.load(next, 0) < total && failure === null) {
      const task = { key, ref: run.ref, plan: run.plan, indexes: run.indexes, chunk, claim, cancel };
      const job: Promise<void> = runPoolTask(workers, task)
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
  if (run.callerWorks) {
    while (failure === null) {
      const k = Atomics.add(next, 0, 1);
      if (k >= total) break;
      runStarts(run.problem, [run.indexes[k]], run.plan, cancelled, keep);
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
