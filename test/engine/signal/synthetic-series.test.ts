import { describe, expect, it } from 'vitest';
import { mulberry32 } from '@/src/engine/random';
import { gaussianSeriesWithSpectrum, logLinearSpectrum } from '@/src/engine/signal/synthetic-series';
import { welch, welchStatisticsOf } from '@/src/engine/signal/welch';
import { logPowerBias, logPowerVariance } from '@/src/engine/stats/log-power';

describe('Gaussian series with a given spectrum', () => {
  it('has the PSD asked for, and the log of its Welch estimate the mean psi(K_eff) - ln K_eff and variance psi1(K_eff)', () => {
    // white PSD of 2 unit^2/Hz at 64 Hz; 10 series of 8192 samples, 256-sample segments (63 segments each)
    const rand = mulberry32(11);
    const ln: number[] = [];
    let keff = 0;
    for (let r = 0; r < 10; r++) {
      const x = gaussianSeriesWithSpectrum(() => 2, 8192, 64, rand);
      const est = welch(x, { sampleRateHz: 64, segmentLength: 256 });
      keff = welchStatisticsOf(est).effectiveAverages;
      // bins well inside the band, 3 apart so that they are practically independent
      for (let k = 10; k < 118; k += 3) ln.push(Math.log(est.power[k] / 2));
    }
    const mean = ln.reduce((a, b) => a + b, 0) / ln.length;
    const variance = ln.reduce((a, b) => a + (b - mean) ** 2, 0) / (ln.length - 1);
    const sd = Math.sqrt(logPowerVariance(keff));
    // sample mean and variance within 4 standard errors (normal approximation; common practice)
    expect(Math.abs(mean - logPowerBias(keff))).toBeLessThan((4 * sd) / Math.sqrt(ln.length));
    expect(Math.abs(variance / sd ** 2 - 1)).toBeLessThan(4 * Math.sqrt(2 / (ln.length - 1)));
  });

  it('interpolates ln power linearly and holds the ends', () => {
    const p = logLinearSpectrum([1, 2, 4], [1, 4, 16]);
    expect(p(1.5)).toBeCloseTo(2, 12);
    expect(p(3)).toBeCloseTo(8, 12);
    expect(p(0.2)).toBe(1);
    expect(p(9)).toBe(16);
    expect(() => gaussianSeriesWithSpectrum(() => -1, 64, 10, mulberry32(1))).toThrow(/PSD/);
  });
});
