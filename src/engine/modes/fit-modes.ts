/**
 * Lorentzian mode fit of a power spectrum (3–7 modes and a linear background).
 *
 * A Welch estimate averaged over K independent segments scatters by about
 * P / sqrt(K) per bin (common practice). Weighting by the observed power
 * biases fits low (Neyman's chi-square), so the fit runs twice: first with
 * sigma proportional to the data, then with sigma proportional to that first
 * model (Pearson's chi-square with fixed weights). When K is known the errors
 * are absolute; otherwise the covariance is scaled by the reduced chi-square
 * (as scipy.optimize.curve_fit does by default). Powers are normalised to
 * order one during the fit so that the optimiser sees well-scaled numbers.
 */
import { covarianceFromJtJ } from '@/src/engine/optim/covariance';
import { CONVERGED_REASONS } from '@/src/engine/optim/types';
import { OptimInputError } from '@/src/engine/optim/errors';
import { MODE_FREQUENCY_WINDOW_HZ } from '@/src/engine/tolerances';
import { initialGuess } from './initial-guess';
import { resolveModeFitOptions, type ModeFitOptions } from './options';
import { qualityOfFit } from './quality';
import { paramCount, type FittedMode, type ModeFit } from './types';
import { twoStageLorentzianFit } from './two-stage-fit';

export class ModeFitError extends Error {}

export function fitModes(frequencies: ArrayLike<number>, power: ArrayLike<number>, options: Partial<ModeFitOptions> = {}): ModeFit {
  if (frequencies.length !== power.length) throw new ModeFitError(`frequencies has ${frequencies.length} values but power has ${power.length}`);
  const o = resolveModeFitOptions(options, frequencies);
  const idx: number[] = [];
  for (let i = 0; i < frequencies.length; i++) {
    const f = frequencies[i];
    if (f < o.minHz || f > o.maxHz || (o.exclude && o.exclude[i])) continue;
    if (!Number.isFinite(power[i]) || !(power[i] > 0)) throw new ModeFitError(`power[${i}] must be a positive number, got ${power[i]}`);
    if (idx.length && !(f > frequencies[idx[idx.length - 1]])) throw new ModeFitError(`frequencies must increase (frequencies[${i}] = ${f})`);
    idx.push(i);
  }
  const np = paramCount(o.modes);
  if (idx.length < 2 * np) throw new ModeFitError(`only ${idx.length} usable bins between ${o.minHz} and ${o.maxHz} Hz for ${np} parameters`);
  const freqs = Float64Array.from(idx, (i) => frequencies[i]);
  const raw = Float64Array.from(idx, (i) => power[i]);
  const unit = [...raw].sort((a, b) => a - b)[Math.floor(raw.length / 2)];
  const data = raw.map((v) => v / unit);
  const rel = o.averages ? 1 / Math.sqrt(o.averages) : 1;

  o.guessHz.forEach((u, n) => {
    if (u + MODE_FREQUENCY_WINDOW_HZ < freqs[0] || u - MODE_FREQUENCY_WINDOW_HZ > freqs[freqs.length - 1]) {
      throw new ModeFitError(`mode ${n + 1} (near ${u} Hz) lies outside the fitted band ${freqs[0]}–${freqs[freqs.length - 1]} Hz; fit fewer modes or widen the band`);
    }
  });
  const guess = initialGuess(freqs, data, o.guessHz);
  let final;
  try {
    final = twoStageLorentzianFit({ modes: o.modes, freqs, data, rel, start: guess.start, lower: guess.lower, upper: guess.upper, lm: o.lm, shouldStop: o.shouldStop }).final;
  } catch (e) {
    if (e instanceof OptimInputError) throw new ModeFitError(`the fit could not start: ${e.message}`);
    throw e;
  }

  const dof = freqs.length - np;
  const reduced = dof > 0 ? final.chi2 / dof : Infinity;
  const scale = (o.averages ? 1 : reduced) * o.errorInflation ** 2;
  const cov = covarianceFromJtJ(final.jtj, np, { scale });
  const p = final.params;
  const modes: FittedMode[] = [];
  for (let n = 0; n < o.modes; n++) {
    const [f, a, g] = [p[3 * n], p[3 * n + 1] * unit, p[3 * n + 2]];
    modes.push({
      frequency: f,
      amplitude: a,
      halfWidth: g,
      q: f / (2 * g),
      errors: { frequency: cov.stdErrors[3 * n], amplitude: cov.stdErrors[3 * n + 1] * unit, halfWidth: cov.stdErrors[3 * n + 2] },
    });
  }
  modes.sort((x, y) => x.frequency - y.frequency);
  const converged = CONVERGED_REASONS.includes(final.stopReason) && Number.isFinite(final.chi2);
  const fit: ModeFit = {
    modes,
    background: { b0: p[3 * o.modes] * unit, b1: p[3 * o.modes + 1] * unit },
    misfit: final.chi2,
    dof,
    band: { minHz: o.minHz, maxHz: o.maxHz },
    converged,
    flags: [],
  };
  fit.flags = qualityOfFit(fit, { singular: cov.singular, lower: guess.lower, upper: guess.upper });
  return fit;
}
