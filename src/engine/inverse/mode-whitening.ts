/**
 * Whitening of one observed mode's three correlated residuals. A mode fit
 * reports the correlation R of (frequency, ln peak, half-width) beside their
 * sigmas; the residuals divided by their sigmas then have covariance R, and
 * with R = L L^T (Cholesky) L^-1 applied to the three residuals and to their
 * Jacobian rows gives the generalised chi-square r^T R^-1 r of the mode, with
 * the optimiser unaware of it (as bin-whitening.ts does for spectra).
 */

/** Lower triangle of L: [l00, l10, l11, l20, l21, l22]. */
export type ModeWhitener = Float64Array;

/** Cholesky factor of a 3x3 correlation, or what is wrong with it (not symmetric, not unit diagonal, not positive definite). */
export function modeWhitener(r: readonly (readonly number[])[]): ModeWhitener | string {
  if (r.length !== 3 || r.some((row) => row.length !== 3)) return 'must be a 3x3 matrix';
  for (let a = 0; a < 3; a++) {
    if (Math.abs(r[a][a] - 1) > 1e-9) return `diagonal element [${a}][${a}] must be 1, got ${r[a][a]}`;
    for (let b = 0; b < 3; b++) {
      if (!Number.isFinite(r[a][b]) || Math.abs(r[a][b]) > 1) return `element [${a}][${b}] must lie between -1 and 1`;
      if (Math.abs(r[a][b] - r[b][a]) > 1e-9) return `must be symmetric ([${a}][${b}] differs from [${b}][${a}])`;
    }
  }
  const l10 = r[1][0];
  const d1 = 1 - l10 * l10;
  if (!(d1 > 0)) return 'must be positive definite';
  const l11 = Math.sqrt(d1);
  const l20 = r[2][0];
  const l21 = (r[2][1] - l20 * l10) / l11;
  const d2 = 1 - l20 * l20 - l21 * l21;
  if (!(d2 > 0)) return 'must be positive definite';
  return Float64Array.from([1, l10, l11, l20, l21, Math.sqrt(d2)]);
}

/** v[at], v[at+1], v[at+2] <- L^-1 of them. */
export function whitenTriple(l: ModeWhitener, v: Float64Array, at: number): void {
  const z0 = v[at];
  const z1 = (v[at + 1] - l[1] * z0) / l[2];
  const z2 = (v[at + 2] - l[3] * z0 - l[4] * z1) / l[5];
  v[at + 1] = z1;
  v[at + 2] = z2;
}

/** Rows row..row+2 of a row-major Jacobian with `cols` columns <- L^-1 times them. */
export function whitenTripleRows(l: ModeWhitener, jac: Float64Array, row: number, cols: number): void {
  const a = row * cols;
  const b = a + cols;
  const c = b + cols;
  for (let j = 0; j < cols; j++) {
    const z0 = jac[a + j];
    const z1 = (jac[b + j] - l[1] * z0) / l[2];
    jac[b + j] = z1;
    jac[c + j] = (jac[c + j] - l[3] * z0 - l[4] * z1) / l[5];
  }
}
