/**
 * J^T J and J^T r from a row-major Jacobian, accumulating only the upper
 * triangle and mirroring it (common practice for the normal equations).
 */
export function accumulateNormalEquations(
  jac: Float64Array,
  r: Float64Array,
  m: number,
  n: number,
  jtj: Float64Array,
  jtr: Float64Array,
): void {
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
  for (let a = 0; a < n; a++) for (let b = 0; b < a; b++) jtj[a * n + b] = jtj[b * n + a];
}

/** Sum of squares of v. */
export function sumSquares(v: Float64Array): number {
  let s = 0;
  for (let i = 0; i < v.length; i++) s += v[i] * v[i];
  return s;
}
