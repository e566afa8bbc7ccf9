import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { covarianceFromJtJ } from '@/src/engine/optim/covariance';
import { weightedLorentzianFit } from '@/src/engine/modes/weighted-fit';

interface CurveFitCase {
  name: string;
  modes: number;
  frequencies: number[];
  power: number[];
  sigma: number[];
  start: number[];
  lower: (number | null)[];
  upper: (number | null)[];
  params: number[];
  chi2: number;
  stdErrorsAbsolute: number[];
  stdErrorsScaled: number[];
}
const fixture = JSON.parse(readFileSync(new URL('../../../fixtures/modes/curve-fit-cases.json', import.meta.url), 'utf8')) as {
  cases: CurveFitCase[];
};

describe('weighted Lorentzian fit against scipy.optimize.curve_fit', () => {
  // Reference: scipy.optimize.curve_fit (trf, bounds) — fixtures/modes/generate.py.
  it.each(fixture.cases.map((c) => [c.name, c] as const))('%s: same optimum, misfit and covariance errors', (_n, c) => {
    const r = weightedLorentzianFit({
      modes: c.modes,
      freqs: Float64Array.from(c.frequencies),
      data: Float64Array.from(c.power),
      sigma: Float64Array.from(c.sigma),
      start: Float64Array.from(c.start),
      lower: Float64Array.from(c.lower, (v) => v ?? -Infinity),
      upper: Float64Array.from(c.upper, (v) => v ?? Infinity),
    });
    expect(r.converged).toBe(true);
    expect(Math.abs(r.chi2 - c.chi2) / c.chi2).toBeLessThan(1e-8);
    const np = c.params.length;
    const abs = covarianceFromJtJ(r.jtj, np);
    const dof = c.frequencies.length - np;
    const scaled = covarianceFromJtJ(r.jtj, np, { scale: r.chi2 / dof });
    for (let j = 0; j < np; j++) {
      // parameters agree to a small fraction of their own uncertainty
      expect(Math.abs(r.params[j] - c.params[j])).toBeLessThan(1e-4 * c.stdErrorsAbsolute[j]);
      expect(Math.abs(abs.stdErrors[j] / c.stdErrorsAbsolute[j] - 1)).toBeLessThan(1e-4);
      expect(Math.abs(scaled.stdErrors[j] / c.stdErrorsScaled[j] - 1)).toBeLessThan(1e-4);
    }
  });
});
