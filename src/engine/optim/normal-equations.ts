/**
 * J^T J and J^T r, computing only the upper triangle and mirroring it (common
 * practice for the normal equations). The work is done on the Jacobian's
 * columns (column-major, as a problem with jacobianColumns gives them; a
 * row-major Jacobian is transposed first): each entry is a dot product of two
 * contiguous columns with its own accumulator, four entries per pass. Every
 * sum runs over the rows in order, as a row-by-row accumulation would, so the
 * values are the same bit for bit (a zero term adds nothing to a finite sum);
 * a Jacobian with non-finite entries takes the path that skips exact zeros
 * (0 x Infinity adds nothing).
 */
let scratch = new Float64Array(0);

/** dst (cols x rows, row-major) <- src (rows x cols, row-major) transposed. */
export function transposeInto(src: Float64Array, rows: number, cols: number, dst: Float64Array): void {
  for (let a = 0; a < cols; a++) {
    const ca = a * rows;
    for (let i = 0, ia = a; i < rows; i++, ia += cols) dst[ca + i] = src[ia];
  }
}

/** J^T J (n x n) and J^T r (n) into jtj and jtr from the m x n Jacobian jac and the residuals r. */
type NormalEquations = (jac: Float64Array, r: Float64Array, m: number, n: number, jtj: Float64Array, jtr: Float64Array) => void;

/** The normal equations of a row-major Jacobian (m rows, n columns). */
export const accumulateNormalEquations: NormalEquations = (jac, r, m, n, jtj, jtr) => {
  if (scratch.length < m * n) scratch = new Float64Array(m * n);
  transposeInto(jac, m, n, scratch);
  normalEquationsFromColumns(scratch, r, m, n, jtj, jtr);
};

/** The normal equations of a column-major Jacobian: column a is c[a * m .. a * m + m - 1]. */
export const normalEquationsFromColumns: NormalEquations = (c, r, m, n, jtj, jtr) => {
  let finite = true;
  for (let a = 0; a < n; a++) {
    const ca = a * m;
    let g = 0;
    for (let i = 0; i < m; i++) g += c[ca + i] * r[i];
    jtr[a] = g;
    let b = a;
    for (; b + 3 < n; b += 4) {
      const c0 = b * m,
        c1 = c0 + m,
        c2 = c1 + m,
        c3 = c2 + m;
      let s0 = 0,
        s1 = 0,
        s2 = 0,
        s3 = 0;
      for (let i = 0; i < m; i++) {
        const x = c[ca + i];
        s0 += x * c[c0 + i];
        s1 += x * c[c1 + i];
        s2 += x * c[c2 + i];
        s3 += x * c[c3 + i];
      }
      jtj[a * n + b] = s0;
      jtj[a * n + b + 1] = s1;
      jtj[a * n + b + 2] = s2;
      jtj[a * n + b + 3] = s3;
    }
    for (; b < n; b++) {
      const cb = b * m;
      let s = 0;
      for (let i = 0; i < m; i++) s += c[ca + i] * c[cb + i];
      jtj[a * n + b] = s;
    }
    if (!Number.isFinite(g)) finite = false;
    for (let k = a; k < n; k++) if (!Number.isFinite(jtj[a * n + k])) finite = false;
  }
  if (!finite) skippingZeros(c, r, m, n, jtj, jtr);
  for (let a = 0; a < n; a++) for (let b = 0; b < a; b++) jtj[a * n + b] = jtj[b * n + a];
};

/** The same sums in the same order, each term left out where the entry of column a is an exact zero. */
function skippingZeros(c: Float64Array, r: Float64Array, m: number, n: number, jtj: Float64Array, jtr: Float64Array): void {
  for (let a = 0; a < n; a++) {
    const ca = a * m;
    let g = 0;
    for (let i = 0; i < m; i++) if (c[ca + i] !== 0) g += c[ca + i] * r[i];
    jtr[a] = g;
    for (let b = a; b < n; b++) {
      const cb = b * m;
      let s = 0;
      for (let i = 0; i < m; i++) if (c[ca + i] !== 0) s += c[ca + i] * c[cb + i];
      jtj[a * n + b] = s;
    }
  }
}

/** Sum of squares of v. */
export function sumSquares(v: Float64Array): number {
  let s = 0;
  for (let i = 0; i < v.length; i++) s += v[i] * v[i];
  return s;
}
