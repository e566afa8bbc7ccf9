/**
 * The scatter of a Welch spectrum's bins and its propagation into anything
 * computed from them, one code path for the mode fit's errors (fit-modes.ts)
 * and the observed modes of a mode inversion (inverse/observed-modes.ts).
 *
 * A K-segment Welch average scatters by var(y_k) = y_k^2 / K_eff per bin
 * (chi-square with 2 K_eff degrees of freedom; Bendat & Piersol, Random Data,
 * §8.5). Overlapping segments are not independent: with the window's overlap
 * correlation rho (sum w_t w_{t+step} / sum w_t^2), contiguous segments give
 *   K_eff = K / (1 + 2 (1 - 1/K) rho^2)
 * (Welch 1967, IEEE Trans. Audio Electroacoust. 15, 70; Percival & Walden
 * 1993, eq. 292b, from memory; only neighbours overlap at 50 %). Neighbouring
 * bins of a tapered spectrum are correlated too (HANN_BIN_POWER_CORRELATION),
 * so the bins' covariance is banded:
 *   V_kl = y_k y_l / K_eff * c(|i_k - i_l|),  c(0) = 1,
 * i_k the bin's index on the spectrum's own grid (bins may be left out).
 * First-order propagation (delta method, sandwich form): for quantities
 * q(y) with rows G = dq/dy, cov(q) = G V G^T.
 */
import { hannWelchBinCorrelation } from '@/src/engine/stats/welch-bin-correlation';
import type { WelchStatistics } from '@/src/engine/stats/welch-statistics';
import { HANN_BIN_POWER_CORRELATION, HANN_HALF_OVERLAP_CORRELATION } from '@/src/engine/tolerances';

export interface BinScatter {
  /** Equivalent number of independent averages behind each bin: var(y_k) = y_k^2 / averages. */
  averages: number;
  /** Correlation of two bins' power at grid distance 1, 2, ... (none given: independent bins). */
  lagCorrelation?: readonly number[];
}

/** Equivalent independent averages of K contiguous Welch segments whose windows overlap with correlation rho. */
export function welchEquivalentAverages(segments: number, rho = HANN_HALF_OVERLAP_CORRELATION): number {
  if (!(segments >= 1)) throw new RangeError(`segments must be at least 1, got ${segments}`);
  return segments / (1 + 2 * (1 - 1 / segments) * rho * rho);
}

/**
 * The scatter a spectrum's own Welch statistics state: K_eff independent averages and the Hann bin
 * correlation of the segments actually averaged at their overlap (stats/welch-bin-correlation.ts).
 */
export function welchScatter(w: WelchStatistics): BinScatter {
  return { averages: w.effectiveAverages, lagCorrelation: hannWelchBinCorrelation(w.segments, w.overlap) };
}

/** The scatter of a spectrum of K periodic-Hann segments at 50 % overlap on its own bin grid (the pipeline's Welch). */
export function hannWelchScatter(segments: number): BinScatter {
  return { averages: welchEquivalentAverages(segments), lagCorrelation: HANN_BIN_POWER_CORRELATION };
}

/**
 * cov(q) = G V G^T (nq x nq, row-major) for rows G = dq/dy (nq x nb, row-major), bins y (nb) on grid
 * indexes `index` (nb, increasing; default 0, 1, 2, ...).
 */
export function propagateBinScatter(
  rows: Float64Array,
  nq: number,
  y: ArrayLike<number>,
  scatter: BinScatter,
  index?: ArrayLike<number>,
): Float64Array {
  const nb = y.length;
  if (rows.length !== nq * nb) throw new RangeError(`rows hold ${rows.length} values for ${nq} x ${nb}`);
  if (!(scatter.averages > 0)) throw new RangeError(`averages must be positive, got ${scatter.averages}`);
  const lag = scatter.lagCorrelation ?? [];
  const at = (k: number) => (index ? index[k] : k);
  // U = G diag(y) / sqrt(K_eff); cov = U C U^T with C the banded bin correlation.
  const s = 1 / Math.sqrt(scatter.averages);
  const u = new Float64Array(nq * nb);
  for (let a = 0; a < nq; a++) for (let k = 0; k < nb; k++) u[a * nb + k] = rows[a * nb + k] * y[k] * s;
  const uc = Float64Array.from(u);
  for (let k = 0; k < nb; k++) {
    for (let l = k + 1; l < nb && at(l) - at(k) <= lag.length; l++) {
      const c = lag[at(l) - at(k) - 1];
      for (let a = 0; a < nq; a++) {
        uc[a * nb + k] += c * u[a * nb + l];
        uc[a * nb + l] += c * u[a * nb + k];
      }
    }
  }
  const cov = new Float64Array(nq * nq);
  for (let a = 0; a < nq; a++) {
    for (let b = a; b < nq; b++) {
      let v = 0;
      for (let k = 0; k < nb; k++) v += uc[a * nb + k] * u[b * nb + k];
      cov[a * nq + b] = cov[b * nq + a] = v;
    }
  }
  return cov;
}
