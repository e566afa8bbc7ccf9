/**
 * How a pool worker rebuilds the problem of a run: a problem reference names
 * a builder known to every worker and carries its serialisable input, so the
 * same problem is built in the calling thread and in each worker.
 */
import type { LeastSquaresProblem } from '@/src/engine/optim/types';
import { buildIntervalProblem, type IntervalInput } from '../interval-problem';

export type ProblemRef = { builder: 'interval'; input: IntervalInput };

export function rebuildProblem(ref: ProblemRef): LeastSquaresProblem {
  if (ref.builder === 'interval') return buildIntervalProblem(ref.input).problem;
  throw new Error(`unknown problem builder "${String((ref as { builder: unknown }).builder)}"`);
}
