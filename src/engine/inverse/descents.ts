/**
 * Runs Levenberg–Marquardt from a list of start indexes on one problem, in
 * the calling thread. Used directly when threads = 1 and inside each pool
 * worker otherwise; start i's point depends only on (seed, i), so results do
 * not depend on scheduling.
 */
import { levenbergMarquardt } from '@/src/engine/optim/levenberg-marquardt';
import type { LeastSquaresProblem, LmOptions } from '@/src/engine/optim/types';
import { basinOf, type KnownMinimum } from './clustering';
import { startPoint } from './halton';
import type { StartStop } from './types';

export interface StartOutcome {
  index: number;
  params: Float64Array;
  chi2: number;
  converged: boolean;
  stopReason: StartStop;
  iterations: number;
  evaluations: number;
  jtj: Float64Array;
  /** A start stopped before its search (stopReason 'clustered'): the start whose minimum it is counted in. */
  joins?: number;
}

export interface StartPlan {
  seed: number;
  /** Explicit start points used for the first indexes (warm starts); quasi-random after them. */
  warm?: number[][];
  lm?: Partial<LmOptions>;
  /** Let the problem improve quasi-random starts (e.g. intensities by linear least squares); default true. */
  refine?: boolean;
  /** Minima found by earlier waves: a start that comes close to one is stopped and counted in it (clustering.ts). */
  known?: KnownMinimum[];
}

export function startFor(plan: StartPlan, index: number, problem: LeastSquaresProblem): Float64Array {
  const warm = plan.warm ?? [];
  if (index < warm.length) return Float64Array.from(warm[index]);
  const n = problem.nParams;
  const lo = problem.lower ?? new Float64Array(n).fill(-Infinity);
  const hi = problem.upper ?? new Float64Array(n).fill(Infinity);
  const p = startPoint(index - warm.length, plan.seed, lo, hi);
  if (plan.refine !== false) problem.refineStart?.(p);
  return p;
}

export function runStarts(
  problem: LeastSquaresProblem,
  indexes: number[],
  plan: StartPlan,
  shouldStop?: () => boolean,
  onEach?: (o: StartOutcome) => void,
): StartOutcome[] {
  const out: StartOutcome[] = [];
  const known = plan.known ?? [];
  const n = problem.nParams;
  const bounds = {
    lower: problem.lower ?? new Float64Array(n).fill(-Infinity),
    upper: problem.upper ?? new Float64Array(n).fill(Infinity),
  };
  for (const index of indexes) {
    let joins = -1;
    const earlyStop = known.length
      ? (p: Float64Array, _chi2: number, iterations: number) => (joins = basinOf(p, iterations, known, bounds)) >= 0
      : undefined;
    const r = levenbergMarquardt(problem, startFor(plan, index, problem), plan.lm ?? {}, { shouldStop, earlyStop });
    const o: StartOutcome = {
      index,
      params: Float64Array.from(r.params),
      chi2: r.chi2,
      converged: r.converged,
      stopReason: r.stopReason === 'early-stop' ? 'clustered' : r.stopReason,
      iterations: r.iterations,
      evaluations: r.evaluations,
      jtj: r.jtj,
      ...(r.stopReason === 'early-stop' ? { joins } : {}),
    };
    out.push(o);
    onEach?.(o);
  }
  return out;
}
