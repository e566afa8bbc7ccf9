/**
 * Multi-start driver: runs LM from `starts` reproducible start points (warm
 * starts first, then the seeded quasi-random sequence) in the calling thread
 * (threads = 1) or shared out with the worker pool (threads/), with progress
 * and cancellation callbacks. With `cluster`, starts run in waves and a start
 * that comes close to a minimum of an earlier wave is stopped and counted in
 * it (clustering.ts). It knows nothing of what the problem models: worker
 * threads rebuild it from its reference. Outcomes come back ordered by start
 * index and depend only on (problem, seed, starts), never on the thread count
 * or on scheduling.
 */
import type { LeastSquaresProblem } from '@/src/engine/optim/types';
import { CLUSTER_WAVE } from '@/src/engine/tolerances';
import { knownMinima } from './clustering';
import { runStarts, type StartOutcome, type StartPlan } from './descents';
import { InversionInputError } from './errors';
import type { MultiStartOptions } from './multistart-options';
import type { ProblemRef } from './threads/problem-builders';
import { newRunKey, sharedStarts } from './threads/shared-starts';
import type { InversionCallbacks } from './types';

/** A problem, and (for threads > 1) the reference the pool workers rebuild it from. */
export interface PortableProblem {
  problem: LeastSquaresProblem;
  ref?: ProblemRef;
}

export async function multiStart(
  { problem, ref }: PortableProblem,
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
  const all = Array.from({ length: total }, (_, i) => i);
  const wave = options.cluster ? CLUSTER_WAVE : total;
  const n = problem.nParams;
  const bounds = {
    lower: problem.lower ?? new Float64Array(n).fill(-Infinity),
    upper: problem.upper ?? new Float64Array(n).fill(Infinity),
  };
  if (options.threads > 1 && !ref)
    throw new InversionInputError('threads > 1 needs a problem the worker threads can rebuild (a problem reference)');
  const outcomes: StartOutcome[] = [];
  const key = newRunKey(); // one problem per run in each pool worker, whatever the number of waves
  for (let first = 0; first < total; first += wave) {
    const indexes = all.slice(first, first + wave);
    const known = first > 0 ? knownMinima(outcomes, bounds) : [];
    const wavePlan: StartPlan = known.length ? { ...plan, known } : plan;
    if (options.threads === 1) outcomes.push(...runStarts(problem, indexes, wavePlan, callbacks.shouldCancel, note));
    else {
      const finished = await sharedStarts({
        key,
        problem,
        ref: ref!,
        plan: wavePlan,
        indexes,
        threads: options.threads,
        callerWorks: options.callerWorks,
        shouldCancel: callbacks.shouldCancel,
        onEach: note,
      });
      outcomes.push(...finished);
    }
  }
  return outcomes.sort((a, b) => a.index - b.index);
}
