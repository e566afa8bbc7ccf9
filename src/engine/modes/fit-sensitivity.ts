/**
 * How the result of the two-stage Lorentzian fit (two-stage-fit.ts) moves
 * when the fitted spectrum moves: dq/dp for fit parameters q and spectrum
 * bins y(p), by implicit differentiation of the optimality conditions.
 *
 * At the optimum of S(q; y) = sum_k W_k (L_k(q) - y_k)^2 the gradient
 * F(q, y) = J^T W r vanishes (J = dL/dq, r = L - y), so along a change of y
 * dq/dy = -(dF/dq)^-1 dF/dy (implicit function theorem; Nocedal & Wright,
 * Numerical Optimization, 2nd ed., §A.2). We use the full Hessian
 * dF/dq = J^T W J + sum_k W_k r_k d2L_k/dq2 rather than its Gauss–Newton part,
 * because a predicted spectrum is not exactly Lorentzian (r is not zero) and
 * the weights depend on y too:
 *   first pass, W1 = 1/y^2:    dF1/dy_k = -J1_k W1_k (1 + 2 r1_k / y_k);
 *   second pass, W2 = 1/m1^2 with m1 = L(q1) the first model:
 *     dF2/dy_k = -J_k W2_k,   dF2/dq1 = -sum_k J_k W2_k (2 r_k / m1_k) J1_k.
 * Parameters held on a bound do not move (their rows are zero); nor do the
 * frequency and half-width of a mode whose amplitude is held at zero (they
 * are then undetermined, and callers must not read them as a mode).
 */
import { lorentzianJacobian, lorentzianModel } from './lorentzian';
import { addCurvature, heldSet, mirrorLower, solveFree } from './fit-hessian';
import { paramCount } from './types';

export interface FitSensitivityInput {
  modes: number;
  freqs: Float64Array;
  /** The fitted data y (same normalisation as the parameters). */
  data: Float64Array;
  /** First-pass and final parameters, and the first model (null: one pass only, final = first). */
  first: Float64Array;
  final: Float64Array;
  firstModel: Float64Array | null;
  lower: Float64Array;
  upper: Float64Array;
}

/**
 * dq/dp (np x n, row-major) of the final fit parameters, given dy/dp (nb x n, row-major); dyDp null
 * gives dq/dy itself (n = nb, dy/dp the identity, without storing it).
 */
export function fitSensitivity(input: FitSensitivityInput, dyDp: Float64Array | null, n: number): Float64Array {
  const { modes, freqs, data: y, lower, upper } = input;
  const np = paramCount(modes);
  const nb = freqs.length;
  if (!dyDp && n !== nb) throw new RangeError(`dq/dy has ${nb} columns, not ${n}`);
  const ones = new Float64Array(nb).fill(1);
  const model = new Float64Array(nb);
  const j1 = new Float64Array(nb * np);
  const h = new Float64Array(np * np);
  const c = new Float64Array(nb);

  // First pass: H1 dq1/dp = sum_k J1_k W1_k (1 + 2 r1_k / y_k) dy_k/dp (dy/dp = I: column k is J1_k s_k).
  lorentzianModel(input.first, modes, freqs, model);
  lorentzianJacobian(input.first, modes, freqs, ones, j1);
  const dq1 = new Float64Array(np * n);
  for (let k = 0; k < nb; k++) {
    const w = 1 / (y[k] * y[k]);
    const r = model[k] - y[k];
    c[k] = w * r;
    const s = w * (1 + (2 * r) / y[k]);
    for (let a = 0; a < np; a++) {
      const ja = j1[k * np + a];
      const jaw = ja * w;
      for (let b = 0; b <= a; b++) h[a * np + b] += jaw * j1[k * np + b];
      const jas = ja * s;
      if (!dyDp) dq1[a * n + k] = jas;
      else for (let jj = 0; jj < n; jj++) dq1[a * n + jj] += jas * dyDp[k * n + jj];
    }
  }
  mirrorLower(h, np);
  addCurvature(input.first, modes, freqs, c, h);
  solveFree(h, dq1, np, n, heldSet(input.first, modes, lower, upper));
  const m1 = input.firstModel;
  if (!m1) return dq1;

  // Second pass: H2 dq/dp = sum_k J_k W2_k (dy_k/dp + (2 r_k / m1_k) J1_k dq1/dp). For dq/dy (many
  // columns) the second term is summed first as M dq1/dy, M = sum_k J_k W2_k (2 r_k / m1_k) J1_k^T.
  const jf = new Float64Array(nb * np);
  lorentzianModel(input.final, modes, freqs, model);
  lorentzianJacobian(input.final, modes, freqs, ones, jf);
  h.fill(0);
  const dq = new Float64Array(np * n);
  const v = new Float64Array(n);
  const m = new Float64Array(dyDp ? 0 : np * np);
  for (let k = 0; k < nb; k++) {
    const w = 1 / (m1[k] * m1[k]);
    const r = model[k] - y[k];
    c[k] = w * r;
    const t = (2 * r) / m1[k];
    if (dyDp) {
      for (let jj = 0; jj < n; jj++) {
        let s = 0;
        for (let a = 0; a < np; a++) s += j1[k * np + a] * dq1[a * n + jj];
        v[jj] = dyDp[k * n + jj] + t * s;
      }
    }
    for (let a = 0; a < np; a++) {
      const jaw = jf[k * np + a] * w;
      for (let b = 0; b <= a; b++) h[a * np + b] += jaw * jf[k * np + b];
      if (dyDp) for (let jj = 0; jj < n; jj++) dq[a * n + jj] += jaw * v[jj];
      else {
        dq[a * n + k] += jaw;
        const jawt = jaw * t;
        for (let b = 0; b < np; b++) m[a * np + b] += jawt * j1[k * np + b];
      }
    }
  }
  if (!dyDp) {
    for (let a = 0; a < np; a++) {
      for (let b = 0; b < np; b++) {
        const mab = m[a * np + b];
        if (mab !== 0) for (let jj = 0; jj < n; jj++) dq[a * n + jj] += mab * dq1[b * n + jj];
      }
    }
  }
  mirrorLower(h, np);
  addCurvature(input.final, modes, freqs, c, h);
  solveFree(h, dq, np, n, heldSet(input.final, modes, lower, upper));
  return dq;
}
