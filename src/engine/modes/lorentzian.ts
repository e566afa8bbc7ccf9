/**
 * The Lorentzian mode model and its derivatives with respect to the
 * parameters [f_1, A_1, g_1, ..., b0, b1]. With u = (f - f_n)/g_n and
 * L = 1 / (1 + u^2):
 *   dP/dA_n = L,  dP/df_n = 2 A_n u L^2 / g_n,  dP/dg_n = 2 A_n u^2 L^2 / g_n,
 *   dP/db0 = 1,   dP/db1 = f.
 */

/** P(f) for every frequency. */
export function lorentzianModel(p: ArrayLike<number>, modes: number, freqs: ArrayLike<number>, out: Float64Array): void {
  const b0 = p[3 * modes];
  const b1 = p[3 * modes + 1];
  for (let i = 0; i < freqs.length; i++) {
    const f = freqs[i];
    let v = b0 + b1 * f;
    for (let n = 0; n < modes; n++) {
      const u = (f - p[3 * n]) / p[3 * n + 2];
      v += p[3 * n + 1] / (1 + u * u);
    }
    out[i] = v;
  }
}

/** Row-major derivative matrix dP(f_i)/dp_j, each row divided by scale[i] (pass 1s for the bare derivatives). */
export function lorentzianJacobian(
  p: ArrayLike<number>,
  modes: number,
  freqs: ArrayLike<number>,
  scale: ArrayLike<number>,
  out: Float64Array,
): void {
  const np = 3 * modes + 2;
  for (let i = 0; i < freqs.length; i++) {
    const f = freqs[i];
    const s = 1 / scale[i];
    const row = i * np;
    for (let n = 0; n < modes; n++) {
      const fn = p[3 * n],
        an = p[3 * n + 1],
        gn = p[3 * n + 2];
      const u = (f - fn) / gn;
      const l = 1 / (1 + u * u);
      const l2 = l * l;
      const a2u = 2 * an * u; // shared by both derivatives, in the same order of operations as written out
      out[row + 3 * n] = ((a2u * l2) / gn) * s;
      out[row + 3 * n + 1] = l * s;
      out[row + 3 * n + 2] = ((a2u * u * l2) / gn) * s;
    }
    out[row + 3 * modes] = s;
    out[row + 3 * modes + 1] = f * s;
  }
}
