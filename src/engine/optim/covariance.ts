/**
 * Parameter covariance at a least-squares minimum, C = (J^T J)^-1 (optionally
 * times a scale such as the reduced chi-square), with standard errors, the
 * correlation matrix C_ij / sqrt(C_ii C_jj) and the resolution matrix
 * R = (J^T J)^+ (J^T J) (Menke, Geophysical Data Analysis, §4.4).
 * Computed through the eigen-decomposition of the diagonally scaled matrix so
 * that unresolvable combinations are detected (eigenvalue below
 * COVARIANCE_RCOND times the largest) rather than inverted into noise; then
 * the pseudo-inverse is used and `singular` is set.
 */
import { EigenvalueDecomposition, Matrix } from 'ml-matrix';
import { COVARIANCE_RCOND } from '@/src/engine/tolerances';

export interface CovarianceResult {
  covariance: Float64Array; // n x n row-major
  stdErrors: Float64Array;
  correlation: Float64Array; // n x n row-major
  resolution: Float64Array; // n x n row-major
  singular: boolean;
  rank: number;
}

export function covarianceFromJtJ(
  jtj: Float64Array,
  nParams: number,
  options: { scale?: number; rcond?: number } = {},
): CovarianceResult {
  const n = nParams;
  const scale = options.scale ?? 1;
  const rcond = options.rcond ?? COVARIANCE_RCOND;
  const s = new Float64Array(n);
  for (let j = 0; j < n; j++) {
    const v = jtj[j * n + j];
    s[j] = v > 0 && Number.isFinite(v) ? 1 / Math.sqrt(v) : 0;
  }
  const scaled = Matrix.zeros(n, n);
  for (let a = 0; a < n; a++) for (let b = 0; b < n; b++) scaled.set(a, b, s[a] * jtj[a * n + b] * s[b]);
  const evd = new EigenvalueDecomposition(scaled, { assumeSymmetric: true });
  const values = evd.realEigenvalues;
  const vectors = evd.eigenvectorMatrix;
  const maxEig = Math.max(0, ...values);
  let rank = 0;
  const inv = new Float64Array(n);
  for (let k = 0; k < n; k++) {
    if (maxEig > 0 && values[k] > rcond * maxEig) {
      inv[k] = 1 / values[k];
      rank++;
    }
  }
  const covariance = new Float64Array(n * n);
  const resolution = new Float64Array(n * n);
  for (let a = 0; a < n; a++) {
    for (let b = 0; b < n; b++) {
      let c = 0;
      let rr = 0;
      for (let k = 0; k < n; k++) {
        const vv = vectors.get(a, k) * vectors.get(b, k);
        c += vv * inv[k];
        if (inv[k] !== 0) rr += vv;
      }
      covariance[a * n + b] = scale * s[a] * c * s[b];
      // R = S (S A S)^+ (S A S) S^-1 restricted to scaled space; in the scaled basis it is the projector V_r V_r^T.
      resolution[a * n + b] = s[a] > 0 && s[b] > 0 ? (rr * s[a]) / s[b] : 0;
    }
  }
  const stdErrors = new Float64Array(n);
  const zeroColumn = s.some((v) => v === 0);
  for (let j = 0; j < n; j++) stdErrors[j] = s[j] === 0 ? Infinity : Math.sqrt(Math.max(0, covariance[j * n + j]));
  const correlation = new Float64Array(n * n);
  for (let a = 0; a < n; a++) {
    for (let b = 0; b < n; b++) {
      const den = Math.sqrt(covariance[a * n + a] * covariance[b * n + b]);
      correlation[a * n + b] = a === b ? 1 : den > 0 ? covariance[a * n + b] / den : 0;
    }
  }
  return { covariance, stdErrors, correlation, resolution, singular: rank < n || zeroColumn, rank };
}
