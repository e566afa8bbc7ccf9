/**
 * Fits of a mode-parameter run: every observed mode beside the mode fitted to
 * the predicted spectrum at the stored minimum, with weighted residuals and
 * per-station chi-square per datum. Data: noise-free forward-model spectra of
 * one known source on the pipeline's default grid, with the pipeline's mode
 * fit (fitModes) stored beside them. At the true source the predicted modes
 * go through the same fit of the same spectrum, so every residual vanishes
 * (least squares on exact data: chi-square 0 at the truth, Press et al.,
 * Numerical Recipes 3rd ed., §15.1).
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { closeDatabase, resetDatabase } from '@/test/helpers/db';
import { listRunIntervals } from '@/db/repo/runs';
import { fitModes } from '@/src/engine/modes/fit-modes';
import { executeRun } from '@/src/runs/execute';
import { makeEngineSolver } from '@/src/runs/solver';
import { fitsAt } from '@/src/runs/fits';
import type { RunConfig } from '@/src/runs/config';
import type { InversionResult } from '@/src/engine/inverse/types';
import { makeRunWorld, newRun, SEGMENTS, storeSpectra, TRUTH, truthSpectra } from './world';

const GRID_BAND = { minHz: 3, maxHz: 48, stepHz: 0.1 };

describe('fits of a mode-parameter run', () => {
  beforeAll(resetDatabase);
  afterAll(closeDatabase);

  it('puts every observed mode beside its prediction, residuals vanishing at the true source', async () => {
    const w = await makeRunWorld(1);
    const t = w.starts[0];
    const spectra = truthSpectra(w, GRID_BAND, ['Ez', 'Bns', 'Bew']);
    await storeSpectra(w, spectra, t, {
      fit: (sp) => {
        const fit = fitModes(sp.frequencies, sp.power, { modes: 5, averages: SEGMENTS });
        return { modes: fit.modes, background: fit.background, misfit: fit.misfit };
      },
    });
    const config: RunConfig = { ...w.config, name: 'Mode fits', observables: { kind: 'modes', modes: 3 }, starts: 4 };
    const run = await newRun(w, config);
    expect(await executeRun(run.id, { solve: makeEngineSolver(1), workerId: 'mode-fits' })).toBe('finished');
    const [row] = await listRunIntervals(run.id);
    const best = (row.result as unknown as InversionResult).minima[0];
    expect(best.sources[0].lat).toBeCloseTo(TRUTH.lat, 3);
    expect(best.sources[0].lon).toBeCloseTo(TRUTH.lon, 3);

    const fits = await fitsAt(w.networkId, run.id, t.toISOString(), 0);
    expect(fits.series).toEqual([]);
    const modes = fits.modes!;
    // These stored fits do not record the ranges they left out: every series says its exclusions were assumed.
    expect(new Set(fits.assumedExclusions)).toEqual(new Set(modes.map((m) => `${m.station} ${m.component}`)));
    // Three usable modes per station and component at most; the data count matches the stored run.
    expect(modes.length).toBeGreaterThanOrEqual(15);
    expect(modes.length).toBeLessThanOrEqual(27);
    expect(3 * modes.length).toBe((row.result as unknown as InversionResult).nData);
    for (const m of modes) {
      expect(['Ez', 'Bns', 'Bew']).toContain(m.component);
      expect(m.mode).toBeGreaterThanOrEqual(1);
      for (const v of [m.sigma.frequency, m.sigma.logIntensity, m.sigma.halfWidth]) expect(v).toBeGreaterThan(0);
      // Weighted residuals are (predicted - observed) / sigma, ln for the intensity.
      expect(m.residual.frequency).toBeCloseTo((m.predicted.frequency - m.observed.frequency) / m.sigma.frequency, 9);
      expect(m.residual.logIntensity).toBeCloseTo(
        Math.log(m.predicted.intensity / m.observed.intensity) / m.sigma.logIntensity,
        9,
      );
      expect(m.residual.halfWidth).toBeCloseTo((m.predicted.halfWidth - m.observed.halfWidth) / m.sigma.halfWidth, 9);
      for (const r of [m.residual.frequency, m.residual.logIntensity, m.residual.halfWidth])
        expect(Math.abs(r)).toBeLessThan(1e-3);
    }
    // Modes are numbered 1.. within each station and component.
    const first = modes.filter((m) => m.station === modes[0].station && m.component === modes[0].component);
    expect(first.map((m) => m.mode)).toEqual(first.map((_, i) => i + 1));
    expect(fits.stations).toHaveLength(3);
    for (const s of fits.stations) {
      const mine = modes.filter((m) => m.station === s.station);
      expect(s.bins).toBe(3 * mine.length);
      const chi2 = mine.reduce(
        (a, m) => a + m.residual.frequency ** 2 + m.residual.logIntensity ** 2 + m.residual.halfWidth ** 2,
        0,
      );
      expect(s.chi2PerBin).toBeCloseTo(chi2 / s.bins, 12);
      expect(s.chi2PerBin).toBeLessThan(1e-6);
    }
  }, 180_000); // the run's fits take about 45 s on a loaded two-core machine
});
