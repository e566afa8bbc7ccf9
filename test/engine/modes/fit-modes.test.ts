import { describe, expect, it } from 'vitest';
import { levenbergMarquardt as mlLevenbergMarquardt } from 'ml-levenberg-marquardt';
import { fitModes } from '@/src/engine/modes/fit-modes';
import { initialGuess } from '@/src/engine/modes/initial-guess';
import { weightedLorentzianFit } from '@/src/engine/modes/weighted-fit';
import { lorentzianJacobian, lorentzianModel } from '@/src/engine/modes/lorentzian';
import { FIVE_MODES, lorentzSum, noisySpectrum } from './synthetic';

describe('Lorentzian model derivatives', () => {
  it('match central finite differences', () => {
    const p = new Float64Array([7.9, 1.2, 0.9, 14.3, 0.7, 1.4, 20.6, 0.4, 2.0, 0.05, -1e-3]);
    const f = new Float64Array([5, 7.1, 8.3, 14.4, 19, 25]);
    const jac = new Float64Array(f.length * p.length);
    lorentzianJacobian(p, 3, f, new Float64Array(f.length).fill(1), jac);
    const a = new Float64Array(f.length);
    const b = new Float64Array(f.length);
    for (let j = 0; j < p.length; j++) {
      const h = 1e-6 * Math.max(1, Math.abs(p[j]));
      const pp = Float64Array.from(p);
      const pm = Float64Array.from(p);
      pp[j] += h;
      pm[j] -= h;
      lorentzianModel(pp, 3, f, a);
      lorentzianModel(pm, 3, f, b);
      for (let i = 0; i < f.length; i++) expect(jac[i * p.length + j]).toBeCloseTo((a[i] - b[i]) / (2 * h), 6);
    }
  });
});

describe('mode fit', () => {
  it('returns exact parameters for a noise-free spectrum', () => {
    const frequencies = Array.from({ length: 451 }, (_, i) => i * 0.1);
    const power = frequencies.map((f) => lorentzSum(FIVE_MODES, f));
    const fit = fitModes(frequencies, power, { modes: 5 });
    fit.modes.forEach((m, n) => {
      expect(m.frequency).toBeCloseTo(FIVE_MODES.f[n], 6);
      expect(m.amplitude).toBeCloseTo(FIVE_MODES.a[n], 6);
      expect(m.halfWidth).toBeCloseTo(FIVE_MODES.g[n], 6);
      expect(m.q).toBeCloseTo(FIVE_MODES.f[n] / (2 * FIVE_MODES.g[n]), 5);
    });
    expect(fit.background.b0).toBeCloseTo(FIVE_MODES.b0, 6);
    expect(fit.background.b1).toBeCloseTo(FIVE_MODES.b1, 7);
    expect(fit.converged).toBe(true);
  });

  it.each([1, 2, 3, 4])('recovers known modes from a noisy 100-average spectrum within its errors (seed %i)', (seed) => {
    const k = 100;
    const { frequencies, power } = noisySpectrum(FIVE_MODES, k, seed);
    const fit = fitModes(frequencies, power, { modes: 5, averages: k });
    expect(fit.flags).toEqual([]);
    fit.modes.forEach((m, n) => {
      expect(Math.abs(m.frequency - FIVE_MODES.f[n])).toBeLessThan(4 * m.errors.frequency);
      expect(Math.abs(m.amplitude - FIVE_MODES.a[n])).toBeLessThan(4 * m.errors.amplitude);
      expect(Math.abs(m.halfWidth - FIVE_MODES.g[n])).toBeLessThan(4 * m.errors.halfWidth);
      expect(m.errors.frequency).toBeGreaterThan(0);
    });
    // With correct sigma, chi2 follows a chi-square law with dof degrees of freedom (mean dof, sd sqrt(2 dof)).
    expect(Math.abs(fit.misfit - fit.dof)).toBeLessThan(4 * Math.sqrt(2 * fit.dof));
  });

  it('scales errors by the reduced chi-square when the number of averages is unknown', () => {
    const { frequencies, power } = noisySpectrum(FIVE_MODES, 100, 9);
    const known = fitModes(frequencies, power, { modes: 5, averages: 100 });
    const unknown = fitModes(frequencies, power, { modes: 5 });
    known.modes.forEach((m, n) => {
      expect(unknown.modes[n].frequency).toBeCloseTo(m.frequency, 9);
      expect(unknown.modes[n].errors.frequency / m.errors.frequency).toBeGreaterThan(0.8);
      expect(unknown.modes[n].errors.frequency / m.errors.frequency).toBeLessThan(1.25);
    });
  });

  // ml-levenberg-marquardt 5.1 applies its weights inconsistently between its misfit and its step,
  // so the comparison uses the unweighted (ordinary least-squares) problem both solve alike.
  it('agrees with ml-levenberg-marquardt on the same least-squares problem', () => {
    const k = 60;
    const { frequencies, power } = noisySpectrum(FIVE_MODES, k, 17);
    const idx = frequencies.flatMap((f, i) => (f >= 3 && f <= 36 ? [i] : []));
    const freqs = Float64Array.from(idx, (i) => frequencies[i]);
    const data = Float64Array.from(idx, (i) => power[i]);
    const sigma = new Float64Array(data.length).fill(1);
    const guess = initialGuess(freqs, data, [7.8, 14.1, 20.3, 26.4, 32.5]);
    const ours = weightedLorentzianFit({
      modes: 5,
      freqs,
      data,
      sigma,
      start: guess.start,
      lower: guess.lower,
      upper: guess.upper,
    });
    const np = ours.params.length;
    const theirs = mlLevenbergMarquardt(
      { x: Array.from(freqs), y: Array.from(data) },
      (p: number[]) => (f: number) => {
        const out = new Float64Array(1);
        lorentzianModel(p, 5, [f], out);
        return out[0];
      },
      {
        initialValues: Array.from(guess.start),
        minValues: Array.from(guess.lower, (v) => (Number.isFinite(v) ? v : -1e9)),
        maxValues: Array.from(guess.upper, (v) => (Number.isFinite(v) ? v : 1e9)),
        maxIterations: 2000,
        errorTolerance: 1e-12,
        improvementThreshold: 1e-9,
        jacobianFunction: (p: number[]) => (f: number) => {
          const row = new Float64Array(np);
          lorentzianJacobian(p, 5, [f], [1], row);
          return Array.from(row);
        },
      },
    );
    expect(Math.abs(theirs.parameterError - ours.chi2) / ours.chi2).toBeLessThan(1e-6);
    for (let j = 0; j < np; j++) {
      expect(Math.abs(theirs.parameterValues[j] - ours.params[j])).toBeLessThan(1e-4 * Math.max(1, Math.abs(ours.params[j])));
    }
  });

  it('sorts modes, names bad inputs and flags a spectrum without resonances', () => {
    expect(() => fitModes([1, 2], [1], {})).toThrow(/power has 1/);
    expect(() => fitModes([1, 2, 3], [1, 1, 1], { modes: 9 })).toThrow(/modes must be/);
    const frequencies = Array.from({ length: 451 }, (_, i) => i * 0.1);
    const bad = frequencies.map((f) => (f > 10 && f < 10.2 ? -1 : 1));
    expect(() => fitModes(frequencies, bad, { modes: 5 })).toThrow(/power\[101\]/);
    const flat = frequencies.map((f) => 0.2 + 1e-3 * f);
    const fit = fitModes(
      flat.map((_, i) => frequencies[i]),
      flat,
      { modes: 5 },
    );
    expect(fit.flags).toContain('implausible-modes');
  });

  it('flags a mode pinned to the edge of its search window', () => {
    const frequencies = Array.from({ length: 451 }, (_, i) => i * 0.1);
    const power = frequencies.map((f) => lorentzSum(FIVE_MODES, f));
    // starting the first mode at 11 Hz confines it to 8.5-13.5 Hz, away from its true 7.93 Hz
    const fit = fitModes(frequencies, power, { guessHz: [11, 14.1, 20.3, 26.4, 32.5] });
    expect(fit.flags).toContain('implausible-modes');
    const good = fitModes(frequencies, power, { modes: 5 });
    expect(good.flags).toEqual([]);
  });
});
