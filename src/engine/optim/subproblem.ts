/**
 * A least-squares problem with some parameters held at given values: the
 * remaining parameters form a smaller problem for the same optimiser
 * (profile misfits, fixed-parameter refits).
 */
import { OptimInputError } from './errors';
import type { LeastSquaresProblem } from './types';

export interface Subproblem extends LeastSquaresProblem {
  /** Full parameter vector from a reduced one. */
  expand(reduced: Float64Array, out?: Float64Array): Float64Array;
  /** Reduced vector from a full one. */
  reduce(full: ArrayLike<number>): Float64Array;
}

export function holdParameters(problem: LeastSquaresProblem, held: Map<number, number>): Subproblem {
  const n = problem.nParams;
  const free: number[] = [];
  for (let j = 0; j < n; j++) if (!held.has(j)) free.push(j);
  for (const j of held.keys()) if (j < 0 || j >= n) throw new OptimInputError(`held parameter index ${j} is outside 0..${n - 1}`);
  if (free.length === 0) throw new OptimInputError('every parameter is held; nothing left to optimise');
  const k = free.length;
  const m = problem.nResiduals;
  const full = new Float64Array(n);
  for (const [j, v] of held) full[j] = v;
  const jacFull = new Float64Array(m * n);
  const expand = (reduced: Float64Array, out: Float64Array = full): Float64Array => {
    if (out !== full) out.set(full);
    for (let i = 0; i < k; i++) out[free[i]] = reduced[i];
    return out;
  };
  return {
    nParams: k,
    nResiduals: m,
    lower: problem.lower ? Float64Array.from(free, (j) => problem.lower![j]) : undefined,
    upper: problem.upper ? Float64Array.from(free, (j) => problem.upper![j]) : undefined,
    residuals: (p, out) => problem.residuals(expand(p), out),
    jacobian: (p, out) => {
      problem.jacobian(expand(p), jacFull);
      for (let i = 0; i < m; i++) for (let c = 0; c < k; c++) out[i * k + c] = jacFull[i * n + free[c]];
    },
    expand: (reduced, out) => expand(reduced, out ?? new Float64Array(n)),
    reduce: (fullVec) => Float64Array.from(free, (j) => fullVec[j]),
  };
}
