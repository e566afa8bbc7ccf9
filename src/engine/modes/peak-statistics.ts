/**
 * What a mode fit says about each mode's peak: the fitted model PSD at the
 * mode's centre, amplitude plus background, peak = A_n + b0 + b1 f_n, the
 * standard deviation of ln peak and the correlation of (frequency, ln peak,
 * half-width), all from the full parameter covariance C of the fit
 * (background included) by first-order propagation, cov(q) = G C G^T with
 * d ln peak = (b1 df_n + dA_n + db0 + f_n db1) / peak.
 */
import { paramCount } from './types';

export interface PeakStatistics {
  /** Peak in the fit's units (multiply by the fit's power unit). */
  peak: number;
  /** Standard deviation of ln peak. */
  sdLnPeak: number;
  /** 3x3 correlation of (frequency, ln peak, half-width); 0 off the diagonal where a variance is 0. */
  correlation: number[][];
}

/** Peak statistics of mode n of parameters p ([f, A, g] per mode, then b0, b1) with covariance cov (np x np, row-major). */
export function peakStatistics(p: ArrayLike<number>, cov: ArrayLike<number>, modes: number, n: number): PeakStatistics {
  const np = paramCount(modes);
  const f = p[3 * n];
  const peak = p[3 * n + 1] + p[np - 2] + p[np - 1] * f;
  // rows of G (np each): frequency, ln peak, half-width
  const g = [new Float64Array(np), new Float64Array(np), new Float64Array(np)];
  g[0][3 * n] = 1;
  g[1][3 * n] = p[np - 1] / peak;
  g[1][3 * n + 1] = 1 / peak;
  g[1][np - 2] = 1 / peak;
  g[1][np - 1] = f / peak;
  g[2][3 * n + 2] = 1;
  const c = [0, 1, 2].map((a) =>
    [0, 1, 2].map((b) => {
      let v = 0;
      for (let i = 0; i < np; i++) {
        if (g[a][i] === 0) continue;
        for (let j = 0; j < np; j++) v += g[a][i] * cov[i * np + j] * g[b][j];
      }
      return v;
    }),
  );
  const sd = c.map((row, a) => Math.sqrt(Math.max(0, row[a])));
  const correlation = c.map((row, a) => row.map((v, b) => (a === b ? 1 : sd[a] > 0 && sd[b] > 0 ? v / (sd[a] * sd[b]) : 0)));
  return { peak, sdLnPeak: sd[1], correlation };
}
