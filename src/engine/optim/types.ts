/**
 * Types of the generic damped least-squares optimiser. It knows nothing of the
 * physics: a problem is a residual vector and its Jacobian.
 */

export interface LeastSquaresProblem {
  nParams: number;
  nResiduals: number;
  /** Bounds (entries may be -Infinity / Infinity). */
  lower?: Float64Array;
  upper?: Float64Array;
  /** Weighted residuals r_i = (model_i - data_i) / sigma_i, written into out (length nResiduals). */
  residuals(p: Float64Array, out: Float64Array): void;
  /** Jacobian d r_i / d p_j, row-major nResiduals x nParams, written into out. */
  jacobian(p: Float64Array, out: Float64Array): void;
  /**
   * Optional: the same Jacobian column-major (out[j * nResiduals + i]), for a problem that computes it by columns;
   * the optimiser then forms the normal equations without transposing.
   */
  jacobianColumns?(p: Float64Array, out: Float64Array): void;
  /** Optional: improve a quasi-random start point in place before a multi-start run uses it. */
  refineStart?(p: Float64Array): void;
}

/** Why a Levenberg–Marquardt run ended. */
export type StopReason =
  'misfit-change' | 'step-size' | 'gradient' | 'max-iterations' | 'max-evaluations' | 'non-finite' | 'cancelled' | 'early-stop';

/** Stop reasons that mean "reached a minimum". */
export const CONVERGED_REASONS: readonly StopReason[] = ['misfit-change', 'step-size', 'gradient'];

export interface LmOptions {
  /** Stop when an accepted step lowers chi2 by less than this fraction and the linear model predicts no more. */
  misfitTol: number;
  /** Stop when the scaled step is below this fraction of the scaled parameter vector. */
  stepTol: number;
  /** Stop when max_j |(J^T r)_j| / sqrt((J^T J)_jj chi2) is below this (MINPACK's gtol). */
  gradientTol: number;
  /** Limit on accepted-or-rejected iterations (outer loop passes). */
  maxIterations: number;
  /** Limit on residual evaluations. */
  maxEvaluations: number;
  /** Initial damping lambda, relative to max_j (J^T J)_jj. */
  initialDamping: number;
  /** Damping is kept within [dampingMin, dampingMax] (absolute, in units of D = diag(J^T J)). */
  dampingMin: number;
  dampingMax: number;
}

export interface LmHooks {
  /** Polled once per iteration; returning true ends the run with stopReason 'cancelled'. */
  shouldStop?: () => boolean;
  /**
   * Polled once per iteration with the current point, its chi-square and the iterations so far; returning true
   * ends the run with stopReason 'early-stop' (the caller judged the rest of the run not worth doing).
   */
  earlyStop?: (p: Float64Array, chi2: number, iterations: number) => boolean;
}

export interface LmResult {
  params: Float64Array;
  /** Sum of squared weighted residuals at params. */
  chi2: number;
  iterations: number;
  evaluations: number;
  stopReason: StopReason;
  converged: boolean;
  /** J^T J at params, nParams x nParams row-major. */
  jtj: Float64Array;
}
