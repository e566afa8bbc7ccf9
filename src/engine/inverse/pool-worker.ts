/**
 * Pool worker: rebuilds the problem from its recipe (cached per run key) and
 * runs its share of the starts. Cancellation arrives through a shared flag.
 */
import type { LeastSquaresProblem } from '@/src/engine/optim/types';
import { buildProblem, type ProblemRecipe } from './recipes';
import { runStarts, type StartOutcome, type StartPlan } from './run-starts';

export interface PoolTask {
  key: string;
  recipe: ProblemRecipe;
  plan: StartPlan;
  indexes: number[];
  cancel: SharedArrayBuffer;
}

let cached: { key: string; problem: LeastSquaresProblem } | null = null;

export default function runTask(task: PoolTask): StartOutcome[] {
  if (cached?.key !== task.key) cached = { key: task.key, problem: buildProblem(task.recipe) };
  const flag = new Int32Array(task.cancel);
  return runStarts(cached.problem, task.indexes, task.plan, () => Atomics.load(flag, 0) !== 0);
}
