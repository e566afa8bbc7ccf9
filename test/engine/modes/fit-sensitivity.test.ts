/**
 * Implicit derivative of the two-stage Lorentzian fit (fit-sensitivity.ts)
 * against central differences of the fit itself (Nocedal & Wright,
 * Numerical Optimization, 2nd ed., §8.1), on spectra that are not exactly
 * Lorentzian (a slow ripple on five Lorentzians), so that the residual
 * curvature and the data-dependent weights matter. The Gauss–Newton part
 * alone, (J^T W J)^-1 J^T W dy/dp, is shown to miss by far more.
 */
import { describe, expect, it } from 'vitest';
import { fitSensitivity } from '@/src/engine/modes/fit-sensitivity';
import { initialGuess } from '@/src/engine/modes/initial-guess';
import { lorentzianJacobian, lorentzianModel } from '@/src/engine/modes/lorentzian';
import { twoStageLorentzianFit } from '@/src/engine/modes/two-stage-fit';
import { paramCount } from '@/src/engine/modes/types';
import { USUAL_MODE_FREQUENCIES_HZ } from '@/src/engine/modes/usual-modes';
import { choleskyFactor, choleskySolve } from '@/src/engine/optim/cholesky';
import { FIVE_MODES, lorentzSum } from './synthetic';

const freqs = Float64Array.from({ length: 331 }, (_, i) => 3 + 0.1 * i);
const MODES = 5;
const LM = { misfitTol: 0, stepTol: 1e-14, gradientTol: 1e-15, maxIterations: 500 };

/** A two-parameter family of non-Lorentzian spectra and its derivative. */
function spectrum(p: number[]): { y: Float64Array; dy: Float64Array } {
  const y = new Float64Array(freqs.length);
  const dy = new Float64Array(freqs.length * 2);
  freqs.forEach((f, k) => {
    const base = lorentzSum(FIVE_MODES, f) * (1 + 0.15 * Math.sin(f / 3));
    const c = Math.cos(f / 5);
    const e = Math.exp(-f / 10);
    y[k] = base * (1 + p[0] * c) + p[1] * e;
    dy[2 * k] = base * c;
    dy[2 * k + 1] = e;
  });
  return { y, dy };
}

function fitAt(p: number[]) {
  const { y, dy } = spectrum(p);
  const g = initialGuess(freqs, y, USUAL_MODE_FREQUENCIES_HZ.slice(0, MODES));
  const fit = twoStageLorentzianFit({
    modes: MODES,
    freqs,
    data: y,
    rel: 1,
    start: g.start,
    lower: g.lower,
    upper: g.upper,
    lm: LM,
  });
  return { y, dy, g, fit };
}

describe('implicit derivative of the two-stage mode fit', () => {
  const p0 = [0.05, 0.02];
  const { y, dy, g, fit } = fitAt(p0);
  const np = paramCount(MODES);
  const analytic = fitSensitivity(
    {
      modes: MODES,
      freqs,
      data: y,
      first: fit.first.params,
      final: fit.final.params,
      firstModel: fit.firstModel,
      lower: g.lower,
      upper: g.upper,
    },
    dy,
    2,
  );
  const h = 1e-4; // truncation error ~h^2 and the fits' convergence noise ~1e-10/h both stay below 1e-4 here
  const numeric = new Float64Array(np * 2);
  for (let j = 0; j < 2; j++) {
    const up = [...p0],
      dn = [...p0];
    up[j] += h;
    dn[j] -= h;
    const a = fitAt(up).fit.final.params,
      b = fitAt(dn).fit.final.params;
    for (let q = 0; q < np; q++) numeric[q * 2 + j] = (a[q] - b[q]) / (2 * h);
  }
  const worst = (d: Float64Array) => {
    let w = 0;
    for (let q = 0; q < np; q++)
      for (let j = 0; j < 2; j++)
        w = Math.max(
          w,
          Math.abs(d[q * 2 + j] - numeric[q * 2 + j]) /
            (Math.abs(numeric[q * 2 + j]) + 1e-3 * (Math.abs(fit.final.params[q]) + 1e-3)),
        );
    return w;
  };

  it('fits both passes to a true minimum inside the bounds', () => {
    expect(fit.firstModel).not.toBeNull();
    expect(fit.first.converged && fit.final.converged).toBe(true);
    for (let q = 0; q < np; q++) expect(fit.final.params[q] > g.lower[q] && fit.final.params[q] < g.upper[q]).toBe(true);
  });

  it('matches central differences of the fit', () => {
    expect(worst(analytic)).toBeLessThan(1e-4);
  });

  it('is needed: the Gauss–Newton part alone misses', () => {
    // (J^T W J)^-1 J^T W dy/dp at the final fit with its own weights W = 1/m1^2, ignoring curvature and weight changes.
    const q = fit.final.params;
    const jac = new Float64Array(freqs.length * np);
    lorentzianJacobian(q, MODES, freqs, new Float64Array(freqs.length).fill(1), jac);
    const a = new Float64Array(np * np);
    const rhs = new Float64Array(np * 2);
    freqs.forEach((_, k) => {
      const w = 1 / fit.firstModel![k] ** 2;
      for (let r = 0; r < np; r++) {
        for (let s = 0; s < np; s++) a[r * np + s] += jac[k * np + r] * w * jac[k * np + s];
        for (let j = 0; j < 2; j++) rhs[r * 2 + j] += jac[k * np + r] * w * dy[2 * k + j];
      }
    });
    expect(choleskyFactor(a, np)).toBe(true);
    const gn = new Float64Array(np * 2);
    for (let j = 0; j < 2; j++) {
      const col = Float64Array.from({ length: np }, (_, r) => rhs[r * 2 + j]);
      choleskySolve(a, np, col);
      col.forEach((v, r) => (gn[r * 2 + j] = v));
    }
    const model = new Float64Array(freqs.length);
    lorentzianModel(q, MODES, freqs, model);
    expect(worst(gn)).toBeGreaterThan(100 * worst(analytic));
  });
});
