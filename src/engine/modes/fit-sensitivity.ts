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
import { choleskyFactor, choleskySolve } from '@/src/engine/optim/cholesky';
import { lorentzianJacobian, lorentzianModel } from './lorentzian';
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

/** Adds c_k d2L_k/dq2 summed over bins into h (np x np), c = W r per bin. */
function addCurvature(q: Float64Array, modes: number, freqs: Float64Array, c: Float64Array, h: Float64Array): void {
  const np = paramCount(modes);
  for (let n = 0; n < modes; n++) {
    const a = q[3 * n + 1], g = q[3 * n + 2];
    let ff = 0, fa = 0, fg = 0, ag = 0, gg = 0;
    for (let k = 0; k < freqs.length; k++) {
      const u = (freqs[k] - q[3 * n]) / g;
      const l = 1 / (1 + u * u);
      const l2 = l * l, l3 = l2 * l;
      const w = c[k];
      ff -= w * ((2 * a) / (g * g)) * (l2 - 4 * u * u * l3);
      fa += w * ((2 * u * l2) / g);
      fg -= w * ((2 * a * u) / (g * g)) * (2 * l2 - 4 * u * u * l3);
      ag += w * ((2 * u * u * l2) / g);
      gg -= w * ((2 * a * u * u) / (g * g)) * (3 * l2 - 4 * u * u * l3);
    }
    const i = 3 * n;
    const put = (r: number, s: number, v: number) => {
      h[(i + r) * np + i + s] += v;
      if (r !== s) h[(i + s) * np + i + r] += v;
    };
    put(0, 0, ff); put(0, 1, fa); put(0, 2, fg); put(1, 2, ag); put(2, 2, gg);
  }
}

function heldSet(q: Float64Array, modes: number, lower: Float64Array, upper: Float64Array): Uint8Array {
  const held = new Uint8Array(q.length);
  for (let j = 0; j < q.length; j++) held[j] = q[j] <= lower[j] || q[j] >= upper[j] ? 1 : 0;
  for (let n = 0; n < modes; n++) if (held[3 * n + 1] && !(q[3 * n + 1] > 0)) held[3 * n] = held[3 * n + 2] = 1;
  return held;
}

/** Solve H X = B (np x n, in place in B) over the parameters not held; held rows of X are 0. */
function solveFree(h: Float64Array, b: Float64Array, np: number, n: number, held: Uint8Array): void {
  const free = [...held.keys()].filter((j) => !held[j]);
  const nf = free.length;
  for (let j = 0; j < np; j++) if (held[j]) b.fill(0, j * n, (j + 1) * n);
  if (nf === 0) return;
  let top = 0;
  for (const j of free) top = Math.max(top, Math.abs(h[j * np + j]));
  const a = new Float64Array(nf * nf);
  // A tiny ridge only where the reduced Hessian is not positive definite (a flat direction).
  for (let ridge = 0; ; ridge = ridge ? ridge * 100 : 1e-12 * top) {
    for (let r = 0; r < nf; r++) for (let s = 0; s < nf; s++) a[r * nf + s] = h[free[r] * np + free[s]] + (r === s ? ridge : 0);
    if (choleskyFactor(a, nf) || ridge > top) break;
  }
  const col = new Float64Array(nf);
  for (let c = 0; c < n; c++) {
    for (let r = 0; r < nf; r++) col[r] = b[free[r] * n + c];
    choleskySolve(a, nf, col);
    for (let r = 0; r < nf; r++) b[free[r] * n + c] = Number.isFinite(col[r]) ? col[r] : 0;
  }
}

/** dq/dp (np x n, row-major) of the final fit parameters, given dy/dp (nb x n, row-major). */
export function fitSensitivity(input: FitSensitivityInput, dyDp: Float64Array, n: number): Float64Array {
  const { modes, freqs, data: y, lower, upper } = input;
  const np = paramCount(modes);
  const nb = freqs.length;
  const ones = new Float64Array(nb).fill(1);
  const model = new Float64Array(nb);
  const j1 = new Float64Array(nb * np);
  const h = new Float64Array(np * np);
  const c = new Float64Array(nb);

  // First pass: H1 dq1/dp = sum_k J1_k W1_k (1 + 2 r1_k / y_k) dy_k/dp.
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
      for (let b = 0; b < np; b++) h[a * np + b] += ja * w * j1[k * np + b];
      for (let jj = 0; jj < n; jj++) dq1[a * n + jj] += ja * s * dyDp[k * n + jj];
    }
  }
  addCurvature(input.first, modes, freqs, c, h);
  solveFree(h, dq1, np, n, heldSet(input.first, modes, lower, upper));
  const m1 = input.firstModel;
  if (!m1) return dq1;

  // Second pass: H2 dq/dp = sum_k J_k W2_k (dy_k/dp + (2 r_k / m1_k) J1_k dq1/dp).
  const jf = new Float64Array(nb * np);
  lorentzianModel(input.final, modes, freqs, model);
  lorentzianJacobian(input.final, modes, freqs, ones, jf);
  h.fill(0);
  const dq = new Float64Array(np * n);
  const v = new Float64Array(n);
  for (let k = 0; k < nb; k++) {
    const w = 1 / (m1[k] * m1[k]);
    const r = model[k] - y[k];
    c[k] = w * r;
    for (let jj = 0; jj < n; jj++) {
      let s = 0;
      for (let a = 0; a < np; a++) s += j1[k * np + a] * dq1[a * n + jj];
      v[jj] = dyDp[k * n + jj] + ((2 * r) / m1[k]) * s;
    }
    for (let a = 0; a < np; a++) {
      const ja = jf[k * np + a];
      for (let b = 0; b < np; b++) h[a * np + b] += ja * w * jf[k * np + b];
      for (let jj = 0; jj < n; jj++) dq[a * n + jj] += ja * w * v[jj];
    }
  }
  addCurvature(input.final, modes, freqs, c, h);
  solveFree(h, dq, np, n, heldSet(input.final, modes, lower, upper));
  return dq;
}
