/**
 * Second derivatives of the Lorentzian model, for the full Hessian of a
 * weighted fit, H = J^T W J + sum_k W_k r_k d2L_k/dq2 (used by the implicit
 * derivative of a fit and by its Newton polish). With u = (f - f_n)/g_n and
 * l = 1/(1 + u^2), per mode (A = A_n, g = g_n; derived from dP/df_n =
 * 2 A u l^2 / g, dP/dA_n = l, dP/dg_n = 2 A u^2 l^2 / g):
 *   d2/df2 = -(2A/g^2)(l^2 - 4u^2 l^3),    d2/df dA = 2u l^2 / g,
 *   d2/df dg = -(2A u/g^2)(2l^2 - 4u^2 l^3), d2/dA dg = 2u^2 l^2 / g,
 *   d2/dg2 = -(2A u^2/g^2)(3l^2 - 4u^2 l^3),  d2/dA2 = 0; the background is linear.
 * Also which parameters a bounded fit holds fixed.
 */
import { choleskyFactor, choleskySolve } from '@/src/engine/optim/cholesky';
import { paramCount } from './types';

/** Adds c_k d2L_k/dq2 summed over bins into h (np x np), c = W r per bin. */
export function addCurvature(q: Float64Array, modes: number, freqs: Float64Array, c: Float64Array, h: Float64Array): void {
  const np = paramCount(modes);
  for (let n = 0; n < modes; n++) {
    const a = q[3 * n + 1],
      g = q[3 * n + 2];
    let ff = 0,
      fa = 0,
      fg = 0,
      ag = 0,
      gg = 0;
    for (let k = 0; k < freqs.length; k++) {
      const u = (freqs[k] - q[3 * n]) / g;
      const l = 1 / (1 + u * u);
      const l2 = l * l,
        l3 = l2 * l;
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
    put(0, 0, ff);
    put(0, 1, fa);
    put(0, 2, fg);
    put(1, 2, ag);
    put(2, 2, gg);
  }
}

/**
 * Copy the lower triangle of h (np x np) into the upper one: the J^T W J sums are accumulated over the
 * lower triangle only (the one the Cholesky factor reads), halving their cost with the same factor.
 */
export function mirrorLower(h: Float64Array, np: number): void {
  for (let a = 0; a < np; a++) for (let b = a + 1; b < np; b++) h[a * np + b] = h[b * np + a];
}

/** Parameters on a bound, and the frequency and half-width of a mode whose amplitude is held at zero. */
export function heldSet(q: Float64Array, modes: number, lower: Float64Array, upper: Float64Array): Uint8Array {
  const held = new Uint8Array(q.length);
  for (let j = 0; j < q.length; j++) held[j] = q[j] <= lower[j] || q[j] >= upper[j] ? 1 : 0;
  for (let n = 0; n < modes; n++) if (held[3 * n + 1] && !(q[3 * n + 1] > 0)) held[3 * n] = held[3 * n + 2] = 1;
  return held;
}

/** Solve H X = B (np x n, in place in B) over the parameters not held; held rows of X are 0. */
export function solveFree(h: Float64Array, b: Float64Array, np: number, n: number, held: Uint8Array): void {
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
