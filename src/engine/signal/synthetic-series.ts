/**
 * A stationary Gaussian time series with a given one-sided power spectral
 * density, for recovery studies and the statistical self-checks: random
 * phases and Gaussian amplitudes per DFT frequency (the spectral
 * representation of a stationary process; Percival & Walden 1993, Spectral
 * Analysis for Physical Applications, ch. 4, from memory),
 *   x_t = Re sum_j c_j exp(2 pi i j t / n),  c_j = s_j (a_j + i b_j),
 * a_j, b_j standard normal, s_j = sqrt(P(f_j) fs / n), f_j = j fs / n,
 * j = 1 .. n/2 - 1, so that E[x_t^2] = sum_j P(f_j) fs / n (the PSD
 * integrated over frequency). Computed with one forward DFT of length n
 * (Re DFT(c) = Re of the sum above, as conj(c) has the law of c).
 */
import { gaussian } from '@/src/engine/random';
import { complexDft } from './complex-dft';

/** n samples at sampleRateHz whose one-sided PSD is `psd(f)` (unit^2/Hz), drawn from `rand`. */
export function gaussianSeriesWithSpectrum(
  psd: (f: number) => number,
  n: number,
  sampleRateHz: number,
  rand: () => number,
): Float64Array {
  if (!Number.isInteger(n) || n < 4) throw new RangeError(`series length must be a whole number of at least 4, got ${n}`);
  if (!(sampleRateHz > 0)) throw new RangeError(`sample rate must be positive, got ${sampleRateHz}`);
  const c = new Float64Array(2 * n);
  for (let j = 1; j < n / 2; j++) {
    const p = psd((j * sampleRateHz) / n);
    if (!(p >= 0) || !Number.isFinite(p)) throw new RangeError(`PSD at ${(j * sampleRateHz) / n} Hz must be >= 0, got ${p}`);
    const s = Math.sqrt((p * sampleRateHz) / n);
    c[2 * j] = s * gaussian(rand);
    c[2 * j + 1] = s * gaussian(rand);
  }
  const out = new Float64Array(2 * n);
  complexDft(n).forward(c, out);
  const x = new Float64Array(n);
  for (let t = 0; t < n; t++) x[t] = out[2 * t];
  return x;
}

/** PSD by linear interpolation of ln power between listed frequencies (increasing), held constant beyond the ends. */
export function logLinearSpectrum(frequencies: ArrayLike<number>, power: ArrayLike<number>): (f: number) => number {
  const n = frequencies.length;
  const ln = Float64Array.from(power, Math.log);
  return (f) => {
    if (f <= frequencies[0]) return power[0];
    if (f >= frequencies[n - 1]) return power[n - 1];
    let lo = 0;
    let hi = n - 1;
    while (hi - lo > 1) {
      const mid = (lo + hi) >> 1;
      if (frequencies[mid] <= f) lo = mid;
      else hi = mid;
    }
    const t = (f - frequencies[lo]) / (frequencies[hi] - frequencies[lo]);
    return Math.exp(ln[lo] + t * (ln[hi] - ln[lo]));
  };
}
