/**
 * J^T J and J^T r from a row-major Jacobian, computing only the upper
 * triangle and mirroring it (common practice for the normal equations).
 * The Jacobian is first copied column by column, and each entry is then a
 * dot product of two contiguous columns with its own accumulator, four
 * entries per pass. Every sum still runs over the rows in order, as a
 * row-by-row accumulation would, so the values are the same bit for bit
 * (a zero term adds nothing to a finite sum); a Jacobian with non-finite
 * entries takes the row-by-row path, which skips exact zeros (0 x Infinity).
 */
let cols = new Float64Array(0);

export function accumulateNormalEquations(
  jac: Float64Array,
  r: Float64Array,
  m: number,
  n: number,
  jtj: Float64Array,
  jtr: Float64Array,
): void {
  if (cols.length < m * n) cols = new Float64Array(m * n);
  const c = cols;
  for (let a = 0; a < n; a++) {
    const ca = a * m;
    for (let i = 0, ia = a; i < m; i++, ia += n) c[ca + i] = jac[ia];
  }
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
  if (!finite) rowByRow(jac, r, m, n, jtj, jtr);
  for (let a = 0; a < n; a++) for (let b = 0; b < a; b++) jtj[a * n + b] = jtj[b * n + a];
}

function rowByRow(jac: Float64Array, r: Float64Array, m: number, n: number, jtj: Float64Array, jtr: Float64Array): void {
  jtj.fill(0);
  jtr.fill(0);
  for (let i = 0; i < m; i++) {
    const row = i * n;
    const ri = r[i];
    for (let a = 0; a < n; a++) {
      const ja = jac[row + a];
      if (ja === 0) continue;
      jtr[a] += ja * ri;
      const base = a * n;
      for (let b = a; b < n; b++) jtj[base + b] += ja * jac[row + b];
    }
  }
}

/** Sum of squares of v. */
export function sumSquares(v: Float64Array): number {
  let s = 0;
  for (let i = 0; i < v.length; i++) s += v[i] * v[i];
  return s;
}
