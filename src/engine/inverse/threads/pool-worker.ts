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
  /** Number of starts of the run; indexes at or beyond it are not computed. */
  total: number;
  /** Most starts this task claims. */
  chunk: number;
  /** Int32 counter of the next unclaimed start index (Atomics.add). */
  claim: SharedArrayBuffer;
  cancel: SharedArrayBuffer;
}

let cached: { key: string; problem: LeastSquaresProblem } | null = null;

export default function runTask(task: PoolTask): StartOutcome[] {
  const next = new Int32Array(task.claim);
  if (Atomics.load(next, 0) >= task.total) return [];
  if (cached?.key !== task.key) cached = { key: task.key, problem: rebuildProblem(task.ref) };
  const flag = new Int32Array(task.cancel);
  const out: StartOutcome[] = [];
  for (let k = 0; k < task.chunk; k++) {
    const index = Atomics.add(next, 0, 1);
    if (index >= task.total) break;
    out.push(...runStarts(cached.problem, [index], task.plan, () => Atomics.load(flag, 0) !== 0));
  }
  return out;
}
