/**
 * J^T J and J^T r, computing only the upper triangle and mirroring it (common
 * practice for the normal equations). The work is done on the Jacobian's
 * columns (column-major, as a problem with jacobianColumns gives them; a
 * row-major Jacobian is transposed first): each entry is a dot product of two
 * contiguous columns with its own accumulator, two rows by four columns of
 * entries per pass over the rows. Every sum runs over the rows in order, as a row-by-row accumulation would, so the
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
  let a = 0;
  for (; a + 1 < n; a += 2) twoRows(c, r, m, n, a, jtj, jtr);
  if (a < n) oneRow(c, r, m, n, a, jtj, jtr);
  let finite = true;
  for (let a = 0; a < n; a++) {
    if (!Number.isFinite(jtr[a])) finite = false;
    for (let k = a; k < n; k++) if (!Number.isFinite(jtj[a * n + k])) finite = false;
  }
  if (!finite) skippingZeros(c, r, m, n, jtj, jtr);
  for (let a = 0; a < n; a++) for (let b = 0; b < a; b++) jtj[a * n + b] = jtj[b * n + a];
};

/**
 * Rows a and a + 1 of the upper triangle (and entry (a + 1, a), which the mirroring overwrites with the same
 * value): each pass over the rows reads the two columns once for four columns b, eight sums at a time.
 */
function twoRows(c: Float64Array, r: Float64Array, m: number, n: number, a: number, jtj: Float64Array, jtr: Float64Array) {
  const ca = a * m;
  const cx = ca + m;
  let g0 = 0,
    g1 = 0;
  for (let i = 0; i < m; i++) {
    g0 += c[ca + i] * r[i];
    g1 += c[cx + i] * r[i];
  }
  jtr[a] = g0;
  jtr[a + 1] = g1;
  let b = a;
  for (; b + 3 < n; b += 4) {
    const c0 = b * m,
      c1 = c0 + m,
      c2 = c1 + m,
      c3 = c2 + m;
    let s0 = 0,
      s1 = 0,
      s2 = 0,
      s3 = 0,
      t0 = 0,
      t1 = 0,
      t2 = 0,
      t3 = 0;
    for (let i = 0; i < m; i++) {
      const x = c[ca + i];
      const y = c[cx + i];
      const v0 = c[c0 + i],
        v1 = c[c1 + i],
        v2 = c[c2 + i],
        v3 = c[c3 + i];
      s0 += x * v0;
      s1 += x * v1;
      s2 += x * v2;
      s3 += x * v3;
      t0 += y * v0;
      t1 += y * v1;
      t2 += y * v2;
      t3 += y * v3;
    }
    const ra = a * n + b;
    const rx = ra + n;
    jtj[ra] = s0;
    jtj[ra + 1] = s1;
    jtj[ra + 2] = s2;
    jtj[ra + 3] = s3;
    jtj[rx] = t0;
    jtj[rx + 1] = t1;
    jtj[rx + 2] = t2;
    jtj[rx + 3] = t3;
  }
  for (; b < n; b++) {
    const cb = b * m;
    let s = 0,
      t = 0;
    for (let i = 0; i < m; i++) {
      s += c[ca + i] * c[cb + i];
      t += c[cx + i] * c[cb + i];
    }
    jtj[a * n + b] = s;
    jtj[(a + 1) * n + b] = t;
  }
}

/** Row a of the upper triangle (the last row when n is odd). */
function oneRow(c: Float64Array, r: Float64Array, m: number, n: number, a: number, jtj: Float64Array, jtr: Float64Array) {
  const ca = a * m;
  let g = 0;
  for (let i = 0; i < m; i++) g += c[ca + i] * r[i];
  jtr[a] = g;
  for (let b = a; b < n; b++) {
    const cb = b * m;
    let s = 0;
    for (let i = 0; i < m; i++) s += c[ca + i] * c[cb + i];
    jtj[a * n + b] = s;
  }
}

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
