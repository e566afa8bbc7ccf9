/**
 * Mode-parameter inversion end to end on synthetic data from the forward
 * model: spectra of one known source from the engine's kernel tables, with
 * seeded log-normal scatter of sigma = 1/sqrt(K) per bin (K = 100 Welch
 * segments; Welch 1967, IEEE Trans. Audio Electroacoust. 15, 70), go through
 * the pipeline's Lorentzian fit with errors propagated from that scatter
 * (observedModesOf), and the fitted modes are inverted back for the source.
 *
 * Statistics (common practice): with correctly specified, independent
 * Gaussian errors, chi-square at the true parameters follows chi-square with
 * N degrees of freedom (mean N, sd sqrt(2N)), and at the best fit with
 * N - M (mean N - M, sd sqrt(2(N - M))), M the number of free parameters
 * (Press et al., Numerical Recipes 3rd ed., §15.1). The three residuals of
 * one mode are correlated and a fitted mode is a nonlinear function of the
 * spectrum, so the checks use several noise seeds (none picked out) and
 * bounds of a few standard deviations. The source must come back within
 * 3 standard errors from the covariance at the minimum.
 */
import { describe, expect, it } from 'vitest';
import { invertModes } from '@/src/engine/inverse/invert';
import { observedModesOf } from '@/src/engine/inverse/observed-modes';
import { prepareModes } from '@/src/engine/inverse/interval-problem';
import type { ObservedModes } from '@/src/engine/inverse/types';
import { LINEAR_CAVITY, syntheticObserved, modeTestWorld } from './helpers';

const { stations, band, freqs, truth, unknowns } = modeTestWorld('MR');
const SIGMA = 1 / Math.sqrt(100);
const input = (modes: ObservedModes[]) => ({ cavity: LINEAR_CAVITY, band, stations, modes, unknowns });

function fittedModes(seed: number): ObservedModes[] {
  return syntheticObserved(stations, [truth], freqs, SIGMA, seed)
    .map((s) => observedModesOf(s, { modes: 3 }))
    .filter((m) => m.modes.length > 0);
}

describe('chi-square of fitted modes at the true source', () => {
  it('averages N over eight noise seeds', () => {
    const ratios: number[] = [];
    for (const seed of [7, 8, 9, 10, 11, 12, 13, 14]) {
      const { problem } = prepareModes(input(fittedModes(seed)));
      const r = new Float64Array(problem.nResiduals);
      problem.residuals(Float64Array.from([Math.log(truth.intensity), truth.lat, truth.lon]), r);
      const chi2 = r.reduce((a, v) => a + v * v, 0);
      expect(problem.nData).toBeGreaterThanOrEqual(60);
      // Each seed: within 6 sd of the mean N (a loose bound, as residuals within a mode are correlated).
      expect(Math.abs(chi2 - problem.nData)).toBeLessThan(6 * Math.sqrt(2 * problem.nData));
      ratios.push(chi2 / problem.nData);
    }
    // The mean of eight chi2/N, each with sd sqrt(2/N) (about 0.16 here), has sd about 0.06; allow 4 of those.
    const mean = ratios.reduce((a, v) => a + v, 0) / ratios.length;
    expect(Math.abs(mean - 1)).toBeLessThan(0.25);
  });
});

describe('mode inversion of fitted modes of forward-model spectra', () => {
  for (const seed of [7, 8]) {
    it(`recovers the source within 3 standard errors with chi-square near N - M (noise seed ${seed})`, async () => {
      const res = await invertModes(input(fittedModes(seed)), { starts: 6, seed: 1, threads: 1 });
      expect(res.minima.reduce((n, m) => n + m.count, 0)).toBe(6);
      for (const m of res.minima) expect(Number.isFinite(m.misfit)).toBe(true);
      const best = res.minima[0];
      expect(best.singular).toBe(false);
      const e = best.stdErrors.R1;
      const s = best.sources[0];
      expect(Math.abs(s.lat - truth.lat)).toBeLessThan(3 * e.lat!);
      expect(Math.abs(s.lon - truth.lon)).toBeLessThan(3 * e.lon!);
      expect(Math.abs(s.intensity - truth.intensity)).toBeLessThan(3 * e.intensity!);
      const dof = res.nData - res.nParams;
      expect(Math.abs(best.misfit - dof)).toBeLessThan(4 * Math.sqrt(2 * dof));
    });
  }
});
