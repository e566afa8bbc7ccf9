/**
 * Mode-parameter objective. (1) The predicted modes come out of the same
 * estimator as the observed ones: on one spectrum, the misfit's fit gives
 * the pipeline's fitModes result. (2) The mode misfit's
 * Jacobian (implicit derivative of the fit chained with dP/dp) matches
 * central differences (Nocedal & Wright, Numerical Optimization, 2nd ed.,
 * §8.1). (3) Where the predicted spectrum has no peak near an observed mode,
 * the misfit and its Jacobian stay finite and consistent. (4) Bad input is
 * refused naming the series and mode.
 */
import { describe, expect, it } from 'vitest';
import { fitModes } from '@/src/engine/modes/fit-modes';
import { modeProblem } from '@/src/engine/inverse/mode-objective';
import { modeSeriesSetup, predictedSeriesModes } from '@/src/engine/inverse/predicted-modes';
import { observedModesOf } from '@/src/engine/inverse/observed-modes';
import { buildParameterisation } from '@/src/engine/inverse/parameters';
import { prepareModes } from '@/src/engine/inverse/interval-problem';
import type { Component } from '@/src/engine/components';
import type { ObservedModes } from '@/src/engine/inverse/types';
import {
  analyticKernel,
  centralDifferenceJacobian,
  LINEAR_CAVITY,
  maxColumnRelativeError,
  syntheticObserved,
  modeTestWorld,
} from './helpers';

const { stations, band, freqs, truth, unknowns } = modeTestWorld('MA');

describe('predicted modes go through the pipeline fit', () => {
  const clean = syntheticObserved(stations, [truth], freqs, 0, 1);
  const line = { frequencyHz: 16.7, halfWidthHz: 0.3 }; // a railway supply line, as line suppression marks it
  for (const [modes, lines] of [
    [3, []],
    [5, []],
    [5, [line]],
  ] as const) {
    it(`gives fitModes' own result on the same spectrum (${modes} modes${lines.length ? ', a 16.7 Hz line left out' : ''}, every station and component)`, () => {
      const exclude = Uint8Array.from(freqs, (f) => (lines.some((l) => Math.abs(f - l.frequencyHz) <= l.halfWidthHz) ? 1 : 0));
      if (lines.length) expect(exclude.reduce((a, v) => a + v, 0)).toBeGreaterThanOrEqual(5); // 16.5–16.9 Hz at least (the edges fall to rounding)
      for (const s of clean) {
        // The pipeline's fit run by its optimiser alone to a far tighter stop (the misfit's fit stops at the pipeline's
        // tolerances and then takes Newton steps instead): the same optimum either way.
        const fit = fitModes(s.frequencies, s.power, {
          modes,
          exclude,
          lm: { misfitTol: 0, stepTol: 1e-13, gradientTol: 1e-14, maxIterations: 2000 },
        });
        const obs: ObservedModes = {
          station: s.station,
          component: s.component,
          fit: { modes, ...fit.band, excludeLines: [...lines] },
          modes: fit.modes.map((m) => ({
            frequency: m.frequency,
            intensity: 1,
            halfWidth: m.halfWidth,
            sigmaFrequency: 1,
            sigmaLogIntensity: 1,
            sigmaHalfWidth: 1,
          })),
        };
        const setup = modeSeriesSetup(obs, freqs, 'x');
        expect(Array.from(setup.freqs)).toEqual(
          Array.from(freqs).filter((f, i) => f >= fit.band.minHz && f <= fit.band.maxHz && !exclude[i]),
        );
        const est = predictedSeriesModes(
          setup,
          Array.from(setup.bins, (b) => s.power[b]),
        );
        fit.modes.forEach((m, k) => {
          expect(Math.abs(est.values[3 * k] - m.frequency)).toBeLessThan(1e-6 * m.frequency);
          const peak = m.amplitude + fit.background.b0 + fit.background.b1 * m.frequency;
          if (peak > 0) expect(Math.abs(est.values[3 * k + 1] - Math.log(peak))).toBeLessThan(1e-6);
          expect(Math.abs(est.values[3 * k + 2] - m.halfWidth)).toBeLessThan(1e-6 * m.halfWidth);
        });
      }
    });
  }
});

describe('mode misfit Jacobian', () => {
  const modes = syntheticObserved(stations, [truth], freqs, 0.1, 3)
    .map((s) => observedModesOf(s, { modes: 3 }))
    .filter((m) => m.modes.length);
  // Where a fitted parameter of some predicted spectrum reaches a bound or the second pass switches off,
  // the fit (and the misfit) has a kink and only one-sided derivatives; these points are clear of that.
  for (const x of [
    [Math.log(4e4), 10, 15],
    [Math.log(2.5e4), 0, 20],
  ]) {
    it(`matches central differences away from the truth (${x.map((v) => v.toFixed(2)).join(', ')})`, () => {
      const { problem } = prepareModes({ cavity: LINEAR_CAVITY, band, stations, modes, unknowns });
      const p = Float64Array.from(x);
      const analytic = new Float64Array(problem.nResiduals * problem.nParams);
      problem.jacobian(p, analytic);
      // Step 1e-4: truncation ~h^2 and the fits' convergence noise ~1e-8/h both below the tolerance.
      const numeric = centralDifferenceJacobian(problem, p, 1e-4);
      expect(maxColumnRelativeError(analytic, numeric, problem.nResiduals, problem.nParams)).toBeLessThan(1e-3);
    });
  }
});

describe('mode misfit where the predicted spectrum has no peak near an observed mode', () => {
  // A smooth analytic kernel (helpers.ts) without Lorentzian peaks: the fitted "modes" sit on slopes and
  // bounds, yet the misfit and its Jacobian must be finite everywhere and the Jacobian must still agree
  // with central differences.
  const st = [
    { code: 'NP1', lat: 10, lon: 0 },
    { code: 'NP2', lat: -30, lon: 60 },
  ];
  const grid = Float64Array.from({ length: 166 }, (_, i) => 3 + 0.2 * i);
  const obs: ObservedModes[] = st.flatMap((s) =>
    (['Ez', 'Bns'] as Component[]).map((c) => ({
      station: s.code,
      component: c,
      modes: [7.1, 14.9, 19.2].map((f) => ({
        frequency: f,
        intensity: c === 'Ez' ? 1e-11 : 1e-23,
        halfWidth: 1.2,
        sigmaFrequency: 0.05,
        sigmaLogIntensity: 0.1,
        sigmaHalfWidth: 0.1,
      })),
    })),
  );
  const par = buildParameterisation([
    { name: 'R1', intensity: { min: 10, max: 1e6 }, lat: { min: -40, max: 40 }, lon: { min: -60, max: 90 } },
  ]);
  const problem = modeProblem(st, obs, analyticKernel(grid), par);

  it('gives a finite misfit and a finite Jacobian that matches central differences', () => {
    for (const x of [
      [Math.log(3e4), 5, 20],
      [Math.log(50), -35, 85],
      [Math.log(9e5), 38, -55],
    ]) {
      const p = Float64Array.from(x);
      const r = new Float64Array(problem.nResiduals);
      problem.residuals(p, r);
      for (const v of r) expect(Number.isFinite(v)).toBe(true);
      const jac = new Float64Array(problem.nResiduals * problem.nParams);
      problem.jacobian(p, jac);
      for (const v of jac) expect(Number.isFinite(v)).toBe(true);
      // Fits without a clear peak converge less sharply (noise ~1e-7 in their outputs), so the step is 1e-3: the
      // difference shrinks as h grows (measured at the third point: 1.6e-3 at h = 1e-4, 1.5e-3 at 3e-4, 8.8e-4 at 1e-3),
      // the mark of convergence noise in the differences, not of a wrong derivative.
      expect(
        maxColumnRelativeError(jac, centralDifferenceJacobian(problem, p, 1e-3), problem.nResiduals, problem.nParams),
      ).toBeLessThan(2e-3);
    }
  });
});

describe('bad mode input', () => {
  const par = buildParameterisation(unknowns);
  const kernel = analyticKernel(freqs);
  const one = (md: Partial<ObservedModes['modes'][number]>, extra: Partial<ObservedModes> = {}): ObservedModes[] => [
    {
      station: 'MA1',
      component: 'Ez',
      ...extra,
      modes: [
        { frequency: 7.9, intensity: 1e-11, halfWidth: 1, sigmaFrequency: 0.1, sigmaLogIntensity: 0.1, sigmaHalfWidth: 0.1 },
        {
          frequency: 14,
          intensity: 1e-11,
          halfWidth: 1,
          sigmaFrequency: 0.1,
          sigmaLogIntensity: 0.1,
          sigmaHalfWidth: 0.1,
          ...md,
        },
      ],
    },
  ];
  it('names the series and mode at fault', () => {
    expect(() => modeProblem(stations, one({ sigmaHalfWidth: 0 }), kernel, par)).toThrow(
      /modes\[0\] \(MA1 Ez\)\.modes\[1\]\.sigmaHalfWidth must be a positive number/,
    );
    expect(() => modeProblem(stations, one({ frequency: 11 }), kernel, par)).toThrow(
      /modes\[0\] \(MA1 Ez\)\.modes\[1\]: 11 Hz lies in no mode window/,
    );
    expect(() => modeProblem(stations, one({ frequency: 8.5 }), kernel, par)).toThrow(
      /two observed modes lie in the window of mode 1/,
    );
    expect(() => modeProblem(stations, one({}, { fit: { modes: 3, minHz: 3, maxHz: 5 } }), kernel, par)).toThrow(
      /modes\[0\] \(MA1 Ez\)\.fit: |only \d+ grid bins|outside the grid/,
    );
    expect(() => modeProblem(stations, one({}, { station: 'NOPE' }), kernel, par)).toThrow(/unknown station "NOPE"/);
  });
});
