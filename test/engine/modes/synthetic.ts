/** Synthetic Lorentzian spectra and time series for the mode-fit tests (invented values). */
import FFT from 'fft.js';
import { gammaDeviate, gaussian, mulberry32 } from '@/src/engine/random';

export interface TrueModes {
  f: number[];
  a: number[];
  g: number[];
  b0: number;
  b1: number;
}

export const FIVE_MODES: TrueModes = {
  f: [7.93, 14.22, 20.47, 26.71, 32.86],
  a: [0.9, 0.62, 0.45, 0.3, 0.21],
  g: [0.95, 1.4, 1.85, 2.2, 2.5],
  b0: 0.06,
  b1: -8e-4,
};

export function lorentzSum(t: TrueModes, f: number): number {
  let v = t.b0 + t.b1 * f;
  t.f.forEach((fn, n) => (v += t.a[n] / (1 + ((f - fn) / t.g[n]) ** 2)));
  return v;
}

/**
 * Bins of a K-segment Welch average scatter like P * chi-square(2K) / (2K) = P * Gamma(K, 1) / K
 * (Bendat & Piersol, Random Data, §8.5), drawn here independently per bin.
 */
export function noisySpectrum(t: TrueModes, k: number, seed: number, df = 0.1, maxHz = 45) {
  const rand = mulberry32(seed);
  const frequencies: number[] = [];
  const power: number[] = [];
  for (let f = 0; f <= maxHz + 1e-9; f += df) {
    const ff = Math.round(f / df) * df;
    frequencies.push(ff);
    power.push(lorentzSum(t, ff) * (gammaDeviate(rand, k) / k));
  }
  return { frequencies, power };
}

/**
 * A real time series whose expected one-sided PSD is `psd(f)`: random Fourier
 * coefficients of variance psd * fs * n / 2, transformed back (Timmer & König 1995, A&A 300, 707).
 */
export function seriesWithPsd(psd: (f: number) => number, fs: number, log2n: number, seed: number): Float64Array {
  const n = 2 ** log2n;
  const rand = mulberry32(seed);
  const fft = new FFT(n);
  const spec = fft.createComplexArray() as number[];
  for (let k = 1; k < n / 2; k++) {
    const c = Math.sqrt((psd((k * fs) / n) * fs * n) / 4);
    spec[2 * k] = c * gaussian(rand);
    spec[2 * k + 1] = c * gaussian(rand);
    spec[2 * (n - k)] = spec[2 * k];
    spec[2 * (n - k) + 1] = -spec[2 * k + 1];
  }
  const out = fft.createComplexArray() as number[];
  fft.inverseTransform(out, spec);
  return Float64Array.from({ length: n }, (_, j) => out[2 * j]);
}
