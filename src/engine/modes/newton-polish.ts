/**
 * Newton steps with the full Hessian on a converged weighted Lorentzian fit:
 * Levenberg–Marquardt (Gauss–Newton near the end) converges only linearly
 * when the model does not fit exactly, while Newton's method with
 * H = J^T W J + sum_k W_k r_k d2L_k/dq2 converges quadratically near a
 * minimum (Nocedal & Wright, Numerical Optimization, 2nd ed., §3.3 and
 * §10.3), so a few steps take the fit to full precision. A step is halved
 * until it lowers chi-square (and polishing ends when no halving does);
 * parameters held on a bound stay there.
 */
import { addCurvature, heldSet, mirrorLower, solveFree } from './fit-hessian';
import { lorentzianJacobian, lorentzianModel } from './lorentzian';
import { paramCount } from './types';

const POLISH_HALVINGS = 8;

export interface PolishInput {
  modes: number;
  freqs: Float64Array;
  data: Float64Array;
  sigma: Float64Array;
  lower: Float64Array;
  upper: Float64Array;
}

function chi2At(q: Float64Array, x: PolishInput, model: Float64Array): number {
  lorentzianModel(q, x.modes, x.freqs, model);
  let s = 0;
  for (let k = 0; k < model.length; k++) s += ((model[k] - x.data[k]) / x.sigma[k]) ** 2;
  return s;
}

/** Returns the polished parameters and their chi-square (the input when no step helps). */
export function newtonPolish(x: PolishInput, start: Float64Array, steps: number): { params: Float64Array; chi2: number } {
  const { modes, freqs, data, sigma } = x;
  const np = paramCount(modes);
  const nb = freqs.length;
  const ones = new Float64Array(nb).fill(1);
  const model = new Float64Array(nb);
  const jac = new Float64Array(nb * np);
  const c = new Float64Array(nb);
  const h = new Float64Array(np * np);
  const step = new Float64Array(np);
  let q = Float64Array.from(start);
  let trial = new Float64Array(np);
  // model holds the model of q throughout (the accepted trial's model is the last one evaluated).
  let chi2 = chi2At(q, x, model);
  for (let it = 0; it < steps; it++) {
    lorentzianJacobian(q, modes, freqs, ones, jac);
    h.fill(0);
    step.fill(0);
    for (let k = 0; k < nb; k++) {
      const w = 1 / (sigma[k] * sigma[k]);
      const r = model[k] - data[k];
      c[k] = w * r;
      for (let a = 0; a < np; a++) {
        const jaw = jac[k * np + a] * w;
        step[a] -= jaw * r;
        for (let b = 0; b <= a; b++) h[a * np + b] += jaw * jac[k * np + b];
      }
    }
    mirrorLower(h, np);
    addCurvature(q, modes, freqs, c, h);
    solveFree(h, step, np, 1, heldSet(q, modes, x.lower, x.upper));
    // Backtracking: halve the step until chi-square drops (Nocedal & Wright §3.1).
    let accepted = false;
    for (let half = 0; half < POLISH_HALVINGS && !accepted; half++) {
      const f = 0.5 ** half;
      for (let j = 0; j < np; j++) trial[j] = Math.min(x.upper[j], Math.max(x.lower[j], q[j] + f * step[j]));
      const chi2T = chi2At(trial, x, model);
      if (chi2T < chi2) {
        [q, trial] = [trial, q];
        chi2 = chi2T;
        accepted = true;
      }
    }
    if (!accepted) break;
  }
  return { params: q, chi2 };
}
