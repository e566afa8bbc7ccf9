/**
 * The mode fit's reported errors (the bins' scatter propagated through both
 * weighted passes: fit-errors.ts, bin-scatter.ts) against a seeded Monte
 * Carlo of the same fit.
 *
 * Draws: (a) bins of a K-segment average of non-overlapping segments,
 * power x Gamma(K, 1) / K = power x chi-square(2K) / 2K per bin, independent
 * (Bendat & Piersol, Random Data, §8.5); (b) whole ten-minute time series
 * with the same Lorentzian spectrum (Timmer & König 1995, A&A 300, 707)
 * through the pipeline's Welch (10-s periodic Hann segments at 50 % overlap,
 * 119 segments): overlapping segments and correlated neighbouring bins, which
 * the equivalent number of averages (Welch 1967; Percival & Walden 1993,
 * eq. 292b, from memory) and the banded bin covariance must carry.
 *
 * Checks: the median reported sigma within 25 % of the sample standard
 * deviation of the estimates (the sample sd of N draws scatters by about
 * 1/sqrt(2(N - 1)), 5 % for N = 200: common practice), and the coverage,
 * the share of draws with |estimate - target| < sigma, near the 68.3 % of a
 * normal law (binomial sd sqrt(0.683 x 0.317 / n) for n pooled draws; the
 * bound allows the fit's small bias and its correlated quantities). The
 * target is the fit of the noise-free spectrum: with fewer modes than the
 * spectrum holds, the higher modes' tails leak into the band and the fitted
 * modes are not the true ones (with all five they are, to 1e-6).
 */
import { describe, expect, it } from 'vitest';
import { fitModes } from '@/src/engine/modes/fit-modes';
import { processInterval } from '@/src/engine/pipeline/process-interval';
import type { ModeFit } from '@/src/engine/modes/types';
import { FIVE_MODES, lorentzSum, noisySpectrum, seriesWithPsd } from './synthetic';

const QUANTITIES = ['frequency', 'amplitude', 'halfWidth'] as const;

interface Tally {
  values: number[][][];
  sigmas: number[][][];
  covered: number;
  total: number;
}

function tally(fits: ModeFit[], target: ModeFit): Tally {
  const modes = target.modes.length;
  const t: Tally = { values: [], sigmas: [], covered: 0, total: 0 };
  for (let n = 0; n < modes; n++) {
    t.values.push(QUANTITIES.map(() => []));
    t.sigmas.push(QUANTITIES.map(() => []));
  }
  for (const fit of fits) {
    fit.modes.forEach((m, n) =>
      QUANTITIES.forEach((q, j) => {
        t.values[n][j].push(m[q]);
        t.sigmas[n][j].push(m.errors[q]);
        if (Math.abs(m[q] - target.modes[n][q]) < m.errors[q]) t.covered++;
        t.total++;
      }),
    );
  }
  return t;
}

const sd = (v: number[]) => {
  const mean = v.reduce((a, x) => a + x, 0) / v.length;
  return Math.sqrt(v.reduce((a, x) => a + (x - mean) ** 2, 0) / (v.length - 1));
};
const median = (v: number[]) => [...v].sort((a, b) => a - b)[v.length >> 1];

function expectHonest(t: Tally, modes: number) {
  for (let n = 0; n < modes; n++) {
    QUANTITIES.forEach((q, j) => {
      const ratio = median(t.sigmas[n][j]) / sd(t.values[n][j]);
      expect(ratio, `mode ${n + 1} ${q}: reported / Monte Carlo sd`).toBeGreaterThan(0.75);
      expect(ratio, `mode ${n + 1} ${q}: reported / Monte Carlo sd`).toBeLessThan(1.25);
    });
  }
  // Normal law: P(|z| < 1) = 0.683; 4 binomial sd of the pooled count either side.
  const share = t.covered / t.total;
  const band = 4 * Math.sqrt((0.683 * 0.317) / t.total);
  expect(share).toBeGreaterThan(0.683 - band);
  expect(share).toBeLessThan(0.683 + band);
}

describe('mode-fit errors against a Monte Carlo of the fit', () => {
  it.each([
    { k: 30, modes: 3, draws: 200 },
    { k: 100, modes: 4, draws: 200 },
    { k: 400, modes: 5, draws: 150 },
  ])('chi-square bins, K = $k, $modes modes', ({ k, modes, draws }) => {
    const fits: ModeFit[] = [];
    const grid = noisySpectrum(FIVE_MODES, k, 1).frequencies;
    const target = fitModes(
      grid,
      grid.map((f) => lorentzSum(FIVE_MODES, f)),
      { modes },
    );
    for (let d = 0; d < draws; d++) {
      const { frequencies, power } = noisySpectrum(FIVE_MODES, k, 9000 + d);
      const fit = fitModes(frequencies, power, { modes, averages: k });
      expect(fit.averages).toBe(k);
      fits.push(fit);
    }
    expectHonest(tally(fits, target), modes);
  });

  it('Welch spectra of time series through the pipeline (overlapping Hann segments)', () => {
    const fs = 100;
    const fits: ModeFit[] = [];
    for (let d = 0; d < 120; d++) {
      const x = seriesWithPsd((f) => lorentzSum(FIVE_MODES, f), fs, 16, 500 + d).subarray(0, 600 * fs);
      const r = processInterval(x, { sampleRateHz: fs, modes: 5 });
      expect(r.segments).toBe(119);
      fits.push(r.fit!);
    }
    // K_eff = 119 / (1 + 2 (118/119) (1/6)^2) (Welch 1967; Harris 1978 Table 1 for the overlap correlation)
    expect(fits[0].averages).toBeCloseTo(119 / (1 + (2 * 118) / 119 / 36), 9);
    const grid = Array.from({ length: 451 }, (_, i) => 3 + 0.1 * i);
    const target = fitModes(
      grid,
      grid.map((f) => lorentzSum(FIVE_MODES, f)),
      { modes: 5 },
    );
    target.modes.forEach((m, n) => expect(m.frequency).toBeCloseTo(FIVE_MODES.f[n], 6));
    expectHonest(tally(fits, target), 5);
  });
});
