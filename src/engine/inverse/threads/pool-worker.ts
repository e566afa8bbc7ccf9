/**
 * Pool worker: rebuilds the problem from its reference (cached per run key)
 * and runs up to `chunk` starts, each index claimed from the run's shared
 * counter (so the calling thread and every worker share out the starts
 * without computing one twice). Cancellation arrives through a shared flag.
 */
import type { LeastSquaresProblem } from '@/src/engine/optim/types';
import { runStarts, type StartOutcome, type StartPlan } from '../descents';
import { rebuildProblem, type ProblemRef } from './problem-builders';

export interface PoolTask {
  key: string;
  ref: ProblemRef;
  plan: StartPlan;
  /** The start indexes to search, claimed in this order. */
  indexes: number[];
  /** Most starts this task claims. */
  chunk: number;
  /** Int32 counter of the next unclaimed position in `indexes` (Atomics.add). */
  claim: SharedArrayBuffer;
  cancel: SharedArrayBuffer;
}

let cached: { key: string; problem: LeastSquaresProblem } | null = null;

export default function runTask(task: PoolTask): StartOutcome[] {
  const next = new Int32Array(task.claim);
  const total = task.indexes.length;
  if (Atomics.load(next, 0) >= total) return [];
  if (cached?.key !== task.key) cached = { key: task.key, problem: rebuildProblem(task.ref) };
  const flag = new Int32Array(task.cancel);
  const out: StartOutcome[] = [];
  for (let k = 0; k < task.chunk; k++) {
    const k = Atomics.add(next, 0, 1);
    if (k >= total) break;
    out.push(...runStarts(cached.problem, [task.indexes[k]], task.plan, () => Atomics.load(flag, 0) !== 0));
  }
  return out;
}
