/**
 * Statistical self-check of the stated errors (item of trade: on synthetic
 * data with a known truth the pulls (estimate - truth) / stdError have mean 0
 * and spread 1, and chi-square has mean N and variance 2N; Tarantola 2005,
 * Inverse Problem Theory, ch. 1, and common practice). Raw series from the
 * invented network of self-check-network.ts go through the project's own
 * Welch estimate (with its statistics), then the inversion; 50 realisations.
 */
import { describe, expect, it } from 'vitest';
import { invertModes, invertSpectra } from '@/src/engine/inverse/invert';
import { observedModesOf } from '@/src/engine/inverse/observed-modes';
import { welchObservations } from '@/src/engine/studies/welch-observations';
import { BAND, CAVITY, FIXED_UNKNOWNS, intensityPulls, meanAndSpread, RECORDING, SITES, trueSpectra } from './self-check-network';

const REALISATIONS = 50;

describe('honest errors on raw series of an invented network', () => {
  it('spectrum route: pulls of mean within 0.3 and spread 0.85-1.15, chi2 as chi-square with N degrees of freedom', async () => {
    const truth = trueSpectra();
    const pulls: number[] = [];
    const chi2: number[] = [];
    let n = 0;
    for (let i = 0; i < REALISATIONS; i++) {
      const observed = welchObservations(truth, RECORDING, 5000 + i);
      const res = await invertSpectra(
        { cavity: CAVITY, stations: SITES, observed, unknowns: FIXED_UNKNOWNS },
        { starts: 2, seed: 1, threads: 1 },
      );
      const best = res.minima[0];
      n = res.nData - res.nParams;
      chi2.push(best.misfit);
      expect(Math.abs(best.misfit - n)).toBeLessThan(4 * Math.sqrt(2 * n));
      pulls.push(...intensityPulls(best));
    }
    const p = meanAndSpread(pulls);
    expect(Math.abs(p.mean)).toBeLessThan(0.3);
    expect(p.spread).toBeGreaterThan(0.85);
    expect(p.spread).toBeLessThan(1.15);
    // mean chi2 of R realisations: N +- 4 sqrt(2N / R)
    const c = meanAndSpread(chi2);
    expect(Math.abs(c.mean - n)).toBeLessThan(4 * Math.sqrt((2 * n) / REALISATIONS));
  }, 120_000);

  it('mode route (fit with its 3x3 covariances, then invert): pulls of mean within 0.3 and spread 0.8-1.3, chi2 in range', async () => {
    const truth = trueSpectra();
    const pulls: number[] = [];
    const chi2: number[] = [];
    let n = 0;
    for (let i = 0; i < REALISATIONS; i++) {
      const observed = welchObservations(truth, RECORDING, 5000 + i);
      const modes = observed.map((o) => observedModesOf(o, { modes: 3 })).filter((m) => m.modes.length > 0);
      for (const m of modes) for (const md of m.modes) expect(md.correlation).toHaveLength(3);
      const res = await invertModes(
        { cavity: CAVITY, band: BAND, stations: SITES, modes, unknowns: FIXED_UNKNOWNS },
        { starts: 1, seed: 1, threads: 1 },
      );
      const best = res.minima[0];
      n = res.nData - res.nParams;
      chi2.push(best.misfit / n);
      pulls.push(...intensityPulls(best));
    }
    const p = meanAndSpread(pulls);
    expect(Math.abs(p.mean)).toBeLessThan(0.3);
    expect(p.spread).toBeGreaterThan(0.8);
    expect(p.spread).toBeLessThan(1.3);
    expect(Math.max(...pulls.map(Math.abs))).toBeLessThan(4);
    // mean reduced chi2 of R realisations with about n degrees of freedom each: 1 +- 4 sqrt(2 / (n R)), with room
    // for the first-order propagation of the fit's errors (a few per cent at these averages)
    expect(Math.abs(meanAndSpread(chi2).mean - 1)).toBeLessThan(4 * Math.sqrt(2 / (n * REALISATIONS)) + 0.1);
  }, 300_000);
});
