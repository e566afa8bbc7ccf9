/**
 * Misfit surfaces against the quadratic theory of chi-square near a minimum
 * (Press et al., Numerical Recipes, 3rd ed., §15.6.5): with the other
 * parameters held, chi2 rises by d^T A d (A = the 2x2 block of J^T W J); with
 * them re-optimised (profile), by d^T (C_2x2)^-1 d, C the covariance. Offsets
 * of half a standard error keep the quadratic approximation within a few %.
 */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { inverse, Matrix } from 'ml-matrix';
import { invertCaseSchema } from '@/src/engine/case';
import { inputFromCase } from '@/src/engine/inverse/from-case';
import { invertSpectra } from '@/src/engine/inverse/invert';
import { prepareSpectrum } from '@/src/engine/inverse/spectrum-setup';
import { misfitSurface } from '@/src/engine/inverse/surface';
import { levenbergMarquardt } from '@/src/engine/optim/levenberg-marquardt';
import { covarianceFromJtJ } from '@/src/engine/optim/covariance';

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
    const a = new Matrix([[lm.jtj[ix * n + ix], lm.jtj[ix * n + iy]], [lm.jtj[iy * n + ix], lm.jtj[iy * n + iy]]]);
    const cInv = inverse(new Matrix([[cov.covariance[ix * n + ix], cov.covariance[ix * n + iy]], [cov.covariance[iy * n + ix], cov.covariance[iy * n + iy]]]));
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
    expect(() => misfitSurface(problem, par, { xName: 'R9.lat', yName: 'R1.lon', x: [0], y: [0], mode: 'fixed', at: new Array(6).fill(0) })).toThrow(
      /"R9.lat" is not a free parameter/,
    );
  });
});
