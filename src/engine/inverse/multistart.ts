/**
 * Multi-start driver: runs LM from `starts` reproducible start points (warm
 * starts first, then the seeded quasi-random sequence) in the calling thread
 * (threads = 1) or shared out with the worker pool (threads/), with progress
 * and cancellation callbacks. It knows nothing of what the problem models:
 * worker threads rebuild it from its reference. Outcomes come back ordered by
 * start index, so grouping does not depend on the thread count or on
 * scheduling.
 */
import type { LeastSquaresProblem } from '@/src/engine/optim/types';
import { runStarts, type StartOutcome, type StartPlan } from './descents';
import { InversionInputError } from './errors';
import type { MultiStartOptions } from './multistart-options';
import type { ProblemRef } from './threads/problem-builders';
import { sharedStarts } from './threads/shared-starts';
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
  if (options.threads === 1) {
    const indexes = Array.from({ length: total }, (_, i) => i);
    return runStarts(problem, indexes, plan, callbacks.shouldCancel, note);
  }
  if (!ref) throw new InversionInputError('threads > 1 needs a problem the worker threads can rebuild (a problem reference)');
  return sharedStarts({
    problem,
    ref,
    plan,
    total,
    threads: options.threads,
    callerWorks: options.callerWorks,
    shouldCancel: callbacks.shouldCancel,
    onEach: note,
  });
}
