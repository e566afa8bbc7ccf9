/**
 * Levenberg–Marquardt with box bounds (Levenberg 1944; Marquardt 1963).
 * Each iteration solves (J^T J + lambda D) h = -J^T r by Cholesky, with
 * Marquardt's scaling D = diag(J^T J) kept as the running maximum (Moré 1978,
 * "The Levenberg–Marquardt algorithm: implementation and theory"); the trial
 * point is projected onto the bounds and variables held at a bound by the
 * gradient are frozen. Damping follows Nielsen's gain-ratio rule (Madsen,
 * Nielsen & Tingleff 2004, "Methods for non-linear least squares problems",
 * eq. 2.21). Allocation-free after set-up.
 */
import { choleskyFactor, choleskySolve } from './cholesky';
import { OptimInputError } from './errors';
import { accumulateNormalEquations, normalEquationsFromColumns, sumSquares } from './normal-equations';
import { resolveLmOptions } from './options';
import {
  CONVERGED_REASONS,
  type LeastSquaresProblem,
  type LmHooks,
  type LmOptions,
  type LmResult,
  type StopReason,
} from './types';

function checkProblem(problem: LeastSquaresProblem, start: Float64Array): void {
  const { nParams: n, nResiduals: m, lower, upper } = problem;
  if (!Number.isInteger(n) || n < 1) throw new OptimInputError(`nParams must be a positive integer, got ${n}`);
  if (!Number.isInteger(m) || m < 1) throw new OptimInputError('there are no data to fit (nResiduals is 0)');
  if (start.length !== n) throw new OptimInputError(`start has ${start.length} values but the problem has ${n} parameters`);
  if (lower && lower.length !== n) throw new OptimInputError(`lower bounds have ${lower.length} values, expected ${n}`);
  if (upper && upper.length !== n) throw new OptimInputError(`upper bounds have ${upper.length} values, expected ${n}`);
  for (let j = 0; j < n; j++) {
    if (!Number.isFinite(start[j])) throw new OptimInputError(`start value of parameter ${j} is not finite`);
    if (lower && upper && lower[j] > upper[j])
      throw new OptimInputError(`parameter ${j}: lower bound ${lower[j]} exceeds upper bound ${upper[j]}`);
  }
}

export function levenbergMarquardt(
  problem: LeastSquaresProblem,
  start: Float64Array,
  options: Partial<LmOptions> = {},
  hooks: LmHooks = {},
): LmResult {
  checkProblem(problem, start);
  const o = resolveLmOptions(options);
  const n = problem.nParams;
  const m = problem.nResiduals;
  const lo = problem.lower ?? new Float64Array(n).fill(-Infinity);
  const hi = problem.upper ?? new Float64Array(n).fill(Infinity);
  let p = new Float64Array(n);
  let pT = new Float64Array(n);
  let r = new Float64Array(m);
  let rT = new Float64Array(m);
  const jac = new Float64Array(m * n);
  const jtj = new Float64Array(n * n);
  const g = new Float64Array(n);
  const d = new Float64Array(n);
  const h = new Float64Array(n);
  const work = new Float64Array(n * n);
  const free = new Uint8Array(n);
  /** J^T J and J^T r at p (by columns when the problem offers them). */
  const linearise = () => {
    if (problem.jacobianColumns) {
      problem.jacobianColumns(p, jac);
      normalEquationsFromColumns(jac, r, m, n, jtj, g);
    } else {
      problem.jacobian(p, jac);
      accumulateNormalEquations(jac, r, m, n, jtj, g);
    }
  };
  for (let j = 0; j < n; j++) p[j] = Math.min(hi[j], Math.max(lo[j], start[j]));

  let evaluations = 1;
  let iterations = 0;
  problem.residuals(p, r);
  let chi2 = sumSquares(r);
  const finish = (stopReason: StopReason): LmResult => ({
    params: p,
    chi2,
    iterations,
    evaluations,
    stopReason,
    converged: CONVERGED_REASONS.includes(stopReason),
    jtj: jtj.slice(),
  });
  if (!Number.isFinite(chi2)) return finish('non-finite');
  linearise();
  // With Marquardt scaling D = diag(J^T J), lambda is already relative to the curvature.
  let lambda = Math.min(o.dampingMax, Math.max(o.dampingMin, o.initialDamping));
  let nu = 2;

  while (true) {
    if (hooks.shouldStop?.()) return finish('cancelled');
    if (hooks.earlyStop?.(p, chi2, iterations)) return finish('early-stop');
    if (chi2 === 0) return finish('misfit-change');
    // Scaling, free set and the gradient test.
    let gradCos = 0;
    let nFree = 0;
    for (let j = 0; j < n; j++) {
      const ajj = jtj[j * n + j];
      d[j] = Math.max(d[j], ajj);
      const blocked = (p[j] <= lo[j] && g[j] > 0) || (p[j] >= hi[j] && g[j] < 0);
      free[j] = blocked || ajj === 0 ? 0 : 1;
      if (free[j]) {
        nFree++;
        gradCos = Math.max(gradCos, Math.abs(g[j]) / Math.sqrt(ajj * chi2));
      }
    }
    if (nFree === 0 || gradCos <= o.gradientTol) return finish('gradient');
    if (iterations >= o.maxIterations) return finish('max-iterations');
    iterations++;

    // Inner loop: raise damping until a step lowers chi2.
    while (true) {
      if (evaluations >= o.maxEvaluations) return finish('max-evaluations');
      for (let a = 0; a < n; a++) {
        for (let b = 0; b < n; b++) work[a * n + b] = free[a] && free[b] ? jtj[a * n + b] : 0;
        work[a * n + a] = free[a] ? jtj[a * n + a] + lambda * d[a] : 1;
        h[a] = free[a] ? -g[a] : 0;
      }
      if (!choleskyFactor(work, n)) {
        if (lambda >= o.dampingMax) return finish('non-finite');
        lambda = Math.min(o.dampingMax, lambda * nu);
        nu *= 2;
        continue;
      }
      choleskySolve(work, n, h);
      let stepNorm = 0;
      let pNorm = 0;
      for (let j = 0; j < n; j++) {
        pT[j] = Math.min(hi[j], Math.max(lo[j], p[j] + h[j]));
        h[j] = pT[j] - p[j];
        stepNorm += d[j] * h[j] * h[j];
        pNorm += d[j] * p[j] * p[j];
      }
      stepNorm = Math.sqrt(stepNorm);
      pNorm = Math.sqrt(pNorm);
      if (stepNorm <= o.stepTol * (pNorm + o.stepTol)) return finish('step-size');
      problem.residuals(pT, rT);
      evaluations++;
      const chi2T = sumSquares(rT);
      // Reduction predicted by the linear model: chi2 - |r + J h|^2 = -2 h.g - h.JtJ.h
      let predicted = 0;
      for (let a = 0; a < n; a++) {
        let s = 0;
        for (let b = 0; b < n; b++) s += jtj[a * n + b] * h[b];
        predicted -= 2 * h[a] * g[a] + h[a] * s;
      }
      if (Number.isFinite(chi2T) && chi2T < chi2) {
        const actual = chi2 - chi2T;
        const rho = predicted > 0 ? actual / predicted : 0;
        const relChange = actual / chi2;
        const relPredicted = predicted / chi2;
        [p, pT] = [pT, p];
        [r, rT] = [rT, r];
        chi2 = chi2T;
        linearise();
        lambda = Math.max(o.dampingMin, lambda * Math.max(1 / 3, 1 - (2 * rho - 1) ** 3));
        nu = 2;
        if (relChange <= o.misfitTol && relPredicted <= o.misfitTol) return finish('misfit-change');
        if (stepNorm <= o.stepTol * (pNorm + o.stepTol)) return finish('step-size');
        break;
      }
      if (lambda >= o.dampingMax) return finish(Number.isFinite(chi2T) ? 'step-size' : 'non-finite');
      lambda = Math.min(o.dampingMax, lambda * nu);
      nu *= 2;
    }
  }
}
