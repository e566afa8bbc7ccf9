/**
 * Correlation of a Hann-windowed Welch spectrum's power at one and two bins'
 * distance, for a locally smooth spectrum of Gaussian data. Bin k of segment
 * a and bin k + l of segment b have |E[X X'*]| proportional to
 *   c(d, l) = |sum_t w_t w_{t + d step} exp(2 pi i l t / N)|,  d = b - a,
 * so the averaged power has cov(P_k, P_k+l) proportional to
 * sum_{a,b averaged} c(b - a, l)^2 (Isserlis; Welch 1967, IEEE Trans. Audio
 * Electroacoust. 15, 70; Percival & Walden 1993, Spectral Analysis for
 * Physical Applications, ch. 6, from memory). Within one segment this is
 * (2/3)^2 = 4/9 and (1/6)^2 = 1/36 (Harris 1978, Proc. IEEE 66, 51); the
 * overlapping neighbours add to it (about 0.458 and 0.039 at 50 % overlap).
 * Evaluated on a periodic Hann window of WELCH_CORRELATION_WINDOW_SAMPLES
 * samples (the values hardly depend on the length). The correlation of the
 * logs is taken equal to that of the powers (first order in 1/K_eff).
 */
import { WELCH_CORRELATION_WINDOW_SAMPLES } from '@/src/engine/tolerances';

const cache = new Map<string, [number, number]>();

/**
 * Correlation of the averaged power at lags 1 and 2 bins for Hann segments averaged at the given indexes
 * (or a count of contiguous segments) with the given overlap share.
 */
export function hannWelchBinCorrelation(
  averaged: number | ArrayLike<number>,
  overlap: number,
  windowLength = WELCH_CORRELATION_WINDOW_SAMPLES,
): [number, number] {
  if (!(overlap >= 0 && overlap < 1)) throw new RangeError(`overlap must lie in [0, 1), got ${overlap}`);
  const idx = typeof averaged === 'number' ? Array.from({ length: averaged }, (_, i) => i) : Array.from(averaged);
  if (idx.length < 1) throw new RangeError('no segments averaged');
  const key = `${overlap}|${windowLength}|${idx.join(',')}`;
  const hit = cache.get(key);
  if (hit) return hit;
  const n = windowLength;
  const step = Math.max(1, Math.round(n * (1 - overlap)));
  const w = Float64Array.from({ length: n }, (_, t) => Math.sin((Math.PI * t) / n) ** 2);
  // c2[d][l] = c(d, l)^2 for the segment offsets that overlap
  const c2: number[][] = [];
  for (let d = 0; d * step < n; d++) {
    const row = [0, 0, 0];
    for (let l = 0; l <= 2; l++) {
      let re = 0;
      let im = 0;
      for (let t = 0; t + d * step < n; t++) {
        const v = w[t] * w[t + d * step];
        re += v * Math.cos((2 * Math.PI * l * t) / n);
        im += v * Math.sin((2 * Math.PI * l * t) / n);
      }
      row[l] = re * re + im * im;
    }
    c2.push(row);
  }
  const sum = [0, 0, 0];
  for (let a = 0; a < idx.length; a++) {
    for (let b = a; b < idx.length; b++) {
      const d = idx[b] - idx[a];
      if (d >= c2.length) break;
      for (let l = 0; l <= 2; l++) sum[l] += (b === a ? 1 : 2) * c2[d][l];
    }
  }
  const out: [number, number] = [sum[1] / sum[0], sum[2] / sum[0]];
  if (cache.size > 256) cache.clear();
  cache.set(key, out);
  return out;
}
