/**
 * The bins' scatter of a Welch spectrum (bin-scatter.ts): the equivalent number
 * of averages and the neighbouring-bin correlation against a simulation of the
 * pipeline's Welch estimate on white noise, and the banded propagation against
 * a dense G V G^T computed with ml-matrix.
 */
import { describe, expect, it } from 'vitest';
import { Matrix } from 'ml-matrix';
import { hannWelchScatter, propagateBinScatter, welchEquivalentAverages } from '@/src/engine/modes/bin-scatter';
import { gaussian, mulberry32 } from '@/src/engine/random';
import { welch } from '@/src/engine/signal/welch';
import { HANN_BIN_POWER_CORRELATION } from '@/src/engine/tolerances';

describe('Welch bin scatter', () => {
  it('equivalent averages: K for independent segments, K / (1 + 2 (1 - 1/K) rho^2) with overlap', () => {
    expect(welchEquivalentAverages(1)).toBe(1);
    expect(welchEquivalentAverages(50, 0)).toBe(50);
    // Welch 1967 / Percival & Walden 1993 eq. 292b (from memory), rho = 1/6 for Hann at 50 % (Harris 1978, Table 1)
    expect(welchEquivalentAverages(119)).toBeCloseTo(119 / (1 + (2 * 118) / 119 / 36), 12);
    expect(() => welchEquivalentAverages(0)).toThrow(/segments must be at least 1/);
  });

  it('matches the scatter and bin correlation of simulated Welch spectra of white noise', () => {
    // 40 ten-minute series at 100 Hz, 10-s periodic Hann segments at 50 % overlap (119 segments), bins 3-48 Hz.
    const rnd = mulberry32(5);
    const lags = [0, 0, 0];
    let count = 0;
    for (let d = 0; d < 40; d++) {
      const x = Float64Array.from({ length: 60_000 }, () => gaussian(rnd));
      const e = welch(x, { sampleRateHz: 100, segmentLength: 1000 });
      expect(e.used).toBe(119);
      // White noise of unit variance: expected one-sided density 2 / fs.
      const z = Array.from(e.power.subarray(30, 481), (p) => p / 0.02 - 1);
      for (let k = 0; k + 2 < z.length; k++) {
        for (let l = 0; l < 3; l++) lags[l] += z[k] * z[k + l];
        count++;
      }
    }
    const variance = lags[0] / count;
    const expected = 1 / hannWelchScatter(119).averages;
    // 18 000 correlated values: the variance estimate scatters by a few per cent.
    expect(Math.abs(variance / expected - 1)).toBeLessThan(0.06);
    // Hann: |W2(1)/W2(0)|^2 = (2/3)^2, |W2(2)/W2(0)|^2 = (1/6)^2 for w^2 = 3/8 - cos/2 + cos2/8 (our derivation)
    expect(lags[1] / lags[0]).toBeCloseTo(4 / 9, 1);
    expect(lags[2] / lags[0]).toBeCloseTo(1 / 36, 1);
    expect(HANN_BIN_POWER_CORRELATION).toEqual([4 / 9, 1 / 36]);
  });

  it('propagates through G as the dense G V G^T does, bins left out of the grid included', () => {
    const rnd = mulberry32(11);
    const index = [0, 1, 2, 4, 5, 6, 9, 10, 11, 12];
    const nb = index.length,
      nq = 3;
    const y = Array.from({ length: nb }, () => 0.5 + rnd());
    const g = Float64Array.from({ length: nq * nb }, () => rnd() - 0.5);
    const scatter = { averages: 37, lagCorrelation: [0.4, 0.1] };
    const v = Matrix.zeros(nb, nb);
    for (let k = 0; k < nb; k++) {
      for (let l = 0; l < nb; l++) {
        const lag = Math.abs(index[k] - index[l]);
        const c = lag === 0 ? 1 : lag <= 2 ? scatter.lagCorrelation[lag - 1] : 0;
        v.set(k, l, (c * y[k] * y[l]) / scatter.averages);
      }
    }
    const gm = new Matrix(Array.from({ length: nq }, (_, a) => Array.from(g.subarray(a * nb, (a + 1) * nb))));
    const dense = gm.mmul(v).mmul(gm.transpose());
    const ours = propagateBinScatter(g, nq, y, scatter, index);
    for (let a = 0; a < nq; a++) for (let b = 0; b < nq; b++) expect(ours[a * nq + b]).toBeCloseTo(dense.get(a, b), 12);
    expect(() => propagateBinScatter(g, 2, y, scatter)).toThrow(/rows hold 30 values for 2 x 10/);
  });
});
