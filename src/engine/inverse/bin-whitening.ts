/**
 * Whitening of one series' correlated bins. Neighbouring bins of a Welch
 * spectrum are correlated (stats/welch-bin-correlation.ts), so the bins of
 * one series have a banded correlation matrix C (bandwidth 2): C_kl = c(d),
 * d the distance of bins k and l on the series' own grid, c(0) = 1, c(1) and
 * c(2) the lag correlations, 0 beyond; bins missing from the list (left out,
 * e.g. mains lines) leave their neighbours at a larger distance, so the chain
 * breaks there. With the banded Cholesky factor C = L L^T (Golub & Van Loan,
 * Matrix Computations, §4.3, band Cholesky), residuals and Jacobian are
 * replaced by L^-1 r and L^-1 J (forward substitution, linear in the number of
 * bins; on each Jacobian column, contiguous in a column-major Jacobian), so
 * that sum (L^-1 r)^2 = r^T C^-1 r, the generalised chi-square, and
 * the optimiser works on independent unit-variance residuals without knowing
 * about the correlation.
 */

/** The band Cholesky factor of one series: L_kk, L_k,k-1 and L_k,k-2 per bin. */
export interface BandedWhitener {
  diag: Float64Array;
  /** 1 / diag. */
  invDiag: Float64Array;
  sub1: Float64Array;
  sub2: Float64Array;
}

/**
 * Factor of the correlation of bins at grid positions `pos` (increasing integers) with lag correlations
 * `lag` ([c(1), c(2)]). Throws a RangeError when the matrix is not positive definite.
 */
export function bandedWhitener(pos: ArrayLike<number>, lag: readonly [number, number]): BandedWhitener {
  const n = pos.length;
  const c = (d: number) => (d === 1 ? lag[0] : d === 2 ? lag[1] : 0);
  const diag = new Float64Array(n);
  const sub1 = new Float64Array(n);
  const sub2 = new Float64Array(n);
  for (let k = 0; k < n; k++) {
    // row k of C: C_k,k-2, C_k,k-1, 1 (positions increase, so only the two previous bins can be within lag 2)
    const a2 = k >= 2 ? c(pos[k] - pos[k - 2]) : 0;
    const a1 = k >= 1 ? c(pos[k] - pos[k - 1]) : 0;
    const l2 = a2 !== 0 ? a2 / diag[k - 2] : 0;
    const l1 = k >= 1 ? (a1 - (k >= 2 ? l2 * sub1[k - 1] : 0)) / diag[k - 1] : 0;
    const d2 = 1 - l1 * l1 - l2 * l2;
    if (!(d2 > 0)) throw new RangeError(`bin correlation ${lag.join(', ')} is not positive definite at bin ${k}`);
    diag[k] = Math.sqrt(d2);
    sub1[k] = l1;
    sub2[k] = l2;
  }
  return { diag, invDiag: diag.map((d) => 1 / d), sub1, sub2 };
}

/** r[offset + k] <- (L^-1 r)_k for the series' bins, in place. */
export function whitenResiduals(w: BandedWhitener, r: Float64Array, offset: number): void {
  oneColumn(w, r, offset);
}

/**
 * The series' rows of a column-major Jacobian (column j starts at j * stride) <- L^-1 times them, in place:
 * L^-1 J is L^-1 applied to each column. Three columns advance together down the rows, so that their independent
 * recurrences overlap instead of each waiting on its own previous row.
 */
export function whitenColumns(w: BandedWhitener, jac: Float64Array, offset: number, stride: number, cols: number): void {
  let j = 0;
  for (; j + 2 < cols; j += 3) threeColumns(w, jac, offset + j * stride, stride);
  for (; j < cols; j++) oneColumn(w, jac, offset + j * stride);
}

function oneColumn(w: BandedWhitener, r: Float64Array, at: number): void {
  const n = w.diag.length;
  const { invDiag, sub1, sub2 } = w;
  let v1 = 0;
  let v2 = 0;
  for (let k = 0; k < n; k++) {
    const v = (r[at + k] - sub1[k] * v1 - sub2[k] * v2) * invDiag[k];
    r[at + k] = v;
    v2 = v1;
    v1 = v;
  }
}

function threeColumns(w: BandedWhitener, jac: Float64Array, a: number, stride: number): void {
  const n = w.diag.length;
  const { invDiag, sub1, sub2 } = w;
  const b = a + stride;
  const c = b + stride;
  // a1, a2: the last two whitened values of the first column (b, c: of the others)
  for (let k = 0, a1 = 0, a2 = 0, b1 = 0, b2 = 0, c1 = 0, c2 = 0; k < n; k++) {
    const s1 = sub1[k];
    const s2 = sub2[k];
    const d = invDiag[k];
    const va = (jac[a + k] - s1 * a1 - s2 * a2) * d;
    const vb = (jac[b + k] - s1 * b1 - s2 * b2) * d;
    const vc = (jac[c + k] - s1 * c1 - s2 * c2) * d;
    jac[a + k] = va;
    jac[b + k] = vb;
    jac[c + k] = vc;
    a2 = a1;
    a1 = va;
    b2 = b1;
    b1 = vb;
    c2 = c1;
    c1 = vc;
  }
}

/**
 * Grid positions of a series' kept frequencies on its own grid: the step is the smallest spacing of the series'
 * listed frequencies (all of them, before any were left out).
 */
export function gridPositions(listed: ArrayLike<number>, kept: ArrayLike<number>): Int32Array {
  let step = Infinity;
  for (let k = 1; k < listed.length; k++) {
    const d = listed[k] - listed[k - 1];
    if (d > 0 && d < step) step = d;
  }
  if (!Number.isFinite(step)) return Int32Array.from(kept, (_, k) => 3 * k); // one bin: nothing to correlate
  const f0 = kept.length ? kept[0] : 0;
  return Int32Array.from(kept, (f) => Math.round((f - f0) / step));
}
