/**
 * Misfit surfaces against the quadratic theory of chi-square near a minimum
 * (Press et al., Numerical Recipes, 3rd ed., §15.6.5): with the other
 * parameters held, chi2 rises by d^T A d (A = the 2x2 block of J^T W J); with
 * them re-optimised (profile), by d^T (C_2x2)^-1 d, C the covariance. Offsets
 * of half a standard error keep the quadratic approximation within a few %.
 * The same for a mode-parameter inversion (fitted modes of forward-model
 * spectra): the surface drawn around its minimum is lowest at that minimum.
 */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { inverse, Matrix } from 'ml-matrix';
import { invertCaseSchema } from '@/src/engine/case';
import { inputFromCase } from '@/src/engine/case/spectrum-input';
import { invertSpectra } from '@/src/engine/inverse/invert';
import { prepareModes, prepareSpectrum } from '@/src/engine/inverse/interval-problem';
import type { ObservedModes } from '@/src/engine/inverse/types';
import { fitModes } from '@/src/engine/modes/fit-modes';
import { misfitSurface } from '@/src/engine/inverse/surface';
import { levenbergMarquardt } from '@/src/engine/optim/levenberg-marquardt';
import { covarianceFromJtJ } from '@/src/engine/optim/covariance';
import { LINEAR_CAVITY, syntheticObserved } from './helpers';

describe('misfit surfaces', () => {
  it('rise as the quadratic form of J^T W J (fixed) and of the inverse covariance block (profile)', async () => {
    const input = inputFromCase(invertCaseSchema.parse(JSON.parse(readFileSync('fixtures/cases/recovery.json', 'utf8'))));
    const res = await invertSpectra(input, { starts: 8, seed: 1, threads: 1 });
    const { problem, par } = prepareSpectrum(input);
    // polish the minimum tightly so the gradient is zero to rounding
    const lm = levenbergMarquardt(problem, Float64Array.from(res.minima[0].internal), { misfitTol: 1e-15, stepTol: 1e-14 });
    const at = Array.from(lm.params);
    const n = at.length;
    const cov = covarianceFromJtJ(lm.jtj, n);
    const ix = par.names.indexOf('R1.lat');
    const iy = par.names.indexOf('R2.lon');
    const d = [0.5 * cov.stdErrors[ix], -0.5 * cov.stdErrors[iy]];
    const x = [at[ix], at[ix] + d[0]];
    const y = [at[iy], at[iy] + d[1]];
    const a = new Matrix([
      [lm.jtj[ix * n + ix], lm.jtj[ix * n + iy]],
      [lm.jtj[iy * n + ix], lm.jtj[iy * n + iy]],
    ]);
    const cInv = inverse(
      new Matrix([
        [cov.covariance[ix * n + ix], cov.covariance[ix * n + iy]],
        [cov.covariance[iy * n + ix], cov.covariance[iy * n + iy]],
      ]),
    );
    const quad = (m: Matrix) => Matrix.rowVector(d).mmul(m).mmul(Matrix.columnVector(d)).get(0, 0);
    for (const mode of ['fixed', 'profile'] as const) {
      const s = misfitSurface(problem, par, { xName: 'R1.lat', yName: 'R2.lon', x, y, mode, at });
      expect(s.misfit[0][0]).toBeCloseTo(lm.chi2, 5);
      const rise = s.misfit[1][1] - s.misfit[0][0];
      const expected = quad(mode === 'fixed' ? a : cInv);
      expect(Math.abs(rise - expected) / expected).toBeLessThan(0.05);
    }
    // profile never lies above the fixed slice
    const fixed = misfitSurface(problem, par, { xName: 'R1.lat', yName: 'R2.lon', x, y, mode: 'fixed', at });
    const prof = misfitSurface(problem, par, { xName: 'R1.lat', yName: 'R2.lon', x, y, mode: 'profile', at });
    expect(prof.misfit[1][1]).toBeLessThanOrEqual(fixed.misfit[1][1]);
  });

  it('names a parameter that is not free', () => {
    const input = inputFromCase(invertCaseSchema.parse(JSON.parse(readFileSync('fixtures/cases/recovery.json', 'utf8'))));
    const { problem, par } = prepareSpectrum(input);
    expect(() =>
      misfitSurface(problem, par, { xName: 'R9.lat', yName: 'R1.lon', x: [0], y: [0], mode: 'fixed', at: new Array(6).fill(0) }),
    ).toThrow(/"R9.lat" is not a free parameter/);
  });
});

describe('misfit surfaces of a mode-parameter inversion', () => {
  const stations = [
    { code: 'SF1', lat: 40, lon: -5 },
    { code: 'SF2', lat: -25, lon: 30 },
    { code: 'SF3', lat: 5, lon: 75 },
  ];
  const band = { minHz: 4, maxHz: 36, stepHz: 0.1 };
  const freqs = Float64Array.from({ length: 321 }, (_, i) => band.minHz + band.stepHz * i);
  const segments = 100;
  const unknowns = [{ name: 'R1', intensity: { min: 1e3, max: 1e6 }, lat: { min: -20, max: 25 }, lon: { min: 0, max: 50 } }];
  // Lorentzian mode fits of forward-model spectra with Welch-like scatter 1/sqrt(K) per bin
  // (Welch 1967, IEEE Trans. Audio Electroacoust. 15, 70), read as a run reads stored fits: with the
  // band each was fitted over, so that the predicted modes come from the same estimator.
  const modes: ObservedModes[] = syntheticObserved(
    stations,
    [{ lat: 6, lon: 24, intensity: 3e4 }],
    freqs,
    1 / Math.sqrt(segments),
    5,
  )
    .map((s) => {
      const fit = fitModes(s.frequencies, s.power, { modes: 3, minHz: 4, maxHz: 30, averages: segments });
      return {
        station: s.station,
        component: s.component,
        fit: { modes: 3, ...fit.band },
        modes: fit.modes.flatMap((m) => {
          const peak = m.amplitude + fit.background.b0 + fit.background.b1 * m.frequency;
          const e = m.errors;
          if (!(peak > 0) || !(e.frequency > 0) || !(e.amplitude > 0) || !(e.halfWidth > 0)) return [];
          if (m.frequency - m.halfWidth < band.minHz || m.frequency + m.halfWidth > band.maxHz) return [];
          return [
            {
              frequency: m.frequency,
              intensity: peak,
              halfWidth: m.halfWidth,
              sigmaFrequency: e.frequency,
              sigmaLogIntensity: e.amplitude / peak,
              sigmaHalfWidth: e.halfWidth,
            },
          ];
        }),
      };
    })
    .filter((m) => m.modes.length > 0);
  const input = { cavity: LINEAR_CAVITY, band, stations, modes, unknowns };

  it('passes through the minimum it is drawn around, which is its lowest point', () => {
    const { problem, par } = prepareModes(input);
    // the minimum near the source, found tightly so that no grid point can undercut it by a leftover descent step
    const lm = levenbergMarquardt(problem, Float64Array.from([Math.log(3e4), 6, 24]), { misfitTol: 1e-15, stepTol: 1e-14 });
    expect(lm.converged).toBe(true);
    // With errors that match the fit's scatter, chi-square at the minimum follows a chi-square law with
    // N - M degrees of freedom (mean N - M, sd sqrt(2 (N - M)); Press et al., Numerical Recipes 3rd ed., §15.1).
    // Measured: 63.7 for 60; the fit covariance's errors gave 153.8, without the band 75 702.
    const dof = 3 * modes.reduce((n, m) => n + m.modes.length, 0) - 3;
    expect(Math.abs(lm.chi2 - dof)).toBeLessThan(4 * Math.sqrt(2 * dof));
    const at = Array.from(lm.params);
    const cov = covarianceFromJtJ(lm.jtj, at.length);
    const ix = par.names.indexOf('R1.lat');
    const iy = par.names.indexOf('R1.lon');
    // fixed on 5 x 5 points, profile (an LM fit per point) on 3 x 3
    for (const [mode, steps] of [
      ['fixed', [-1, -0.5, 0, 0.5, 1]],
      ['profile', [-1, 0, 1]],
    ] as const) {
      const grid = (j: number) => steps.map((k) => at[j] + k * cov.stdErrors[j]);
      const c = (steps.length - 1) / 2;
      const s = misfitSurface(problem, par, { xName: 'R1.lat', yName: 'R1.lon', x: grid(ix), y: grid(iy), mode, at });
      // the predicted modes come from an iterative Lorentzian fit of the predicted spectrum,
      // converged to its own tolerance: the same point agrees to about 1e-8 relative
      expect(Math.abs(s.misfit[c][c] - lm.chi2) / lm.chi2).toBeLessThan(1e-6);
      const lowest = Math.min(...s.misfit.flat());
      // chi-square rises away from a minimum (Press et al., Numerical Recipes 3rd ed., §15.6.5)
      expect(lowest).toBeGreaterThanOrEqual(lm.chi2 * (1 - 1e-6));
      expect(s.misfit.flat().indexOf(lowest)).toBe(c * steps.length + c);
      // one standard error out along lat with the others held, chi-square rises by
      // (1/sigma_marginal)^2 sigma^2 >= 1 (the conditional variance is at most the marginal one)
      if (mode === 'fixed') expect(s.misfit[c][steps.length - 1] - lm.chi2).toBeGreaterThan(0.5);
    }
  });
});
