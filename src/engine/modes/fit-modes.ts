/**
 * Lorentzian mode fit of a power spectrum (3–7 modes and a linear background).
 *
 * A Welch estimate of K_eff equivalent independent averages scatters by
 * about P / sqrt(K_eff) per bin (bin-scatter.ts). Weighting by the observed
 * power biases fits low (Neyman's chi-square), so the fit runs twice: first
 * with sigma proportional to the data, then with sigma proportional to that
 * first model (Pearson's chi-square with fixed weights). The errors are the
 * bins' scatter propagated through both passes (fit-errors.ts), not the
 * covariance (J^T W J)^-1, which understates them when the spectrum is not
 * exactly Lorentzian. When K_eff is not given it is estimated from the
 * misfit, dof / chi-square (as scipy.optimize.curve_fit scales by the reduced
 * chi-square by default). A parameter held on a bound does not move with
 * the data; it keeps the covariance's error. Powers are normalised to order
 * one during the fit so that the optimiser sees well-scaled numbers.
 */
import { covarianceFromJtJ } from '@/src/engine/optim/covariance';
import { CONVERGED_REASONS } from '@/src/engine/optim/types';
import { OptimInputError } from '@/src/engine/optim/errors';
import { MODE_FREQUENCY_WINDOW_HZ } from '@/src/engine/tolerances';
import { propagatedFitCovariance } from './fit-errors';
import { excludedRanges } from './excluded-ranges';
import { heldSet } from './fit-hessian';
import { initialGuess } from './initial-guess';
import { peakStatistics } from './peak-statistics';
import { resolveModeFitOptions, type ModeFitOptions } from './options';
import { qualityOfFit } from './quality';
import { paramCount, type FittedMode, type ModeFit } from './types';
import { twoStageLorentzianFit } from './two-stage-fit';

export class ModeFitError extends Error {}

export function fitModes(
  frequencies: ArrayLike<number>,
  power: ArrayLike<number>,
  options: Partial<ModeFitOptions> = {},
): ModeFit {
  if (frequencies.length !== power.length)
    throw new ModeFitError(`frequencies has ${frequencies.length} values but power has ${power.length}`);
  const o = resolveModeFitOptions(options, frequencies);
  const idx: number[] = [];
  for (let i = 0; i < frequencies.length; i++) {
    const f = frequencies[i];
    if (f < o.minHz || f > o.maxHz || (o.exclude && o.exclude[i])) continue;
    if (!Number.isFinite(power[i]) || !(power[i] > 0))
      throw new ModeFitError(`power[${i}] must be a positive number, got ${power[i]}`);
    if (idx.length && !(f > frequencies[idx[idx.length - 1]]))
      throw new ModeFitError(`frequencies must increase (frequencies[${i}] = ${f})`);
    idx.push(i);
  }
  const np = paramCount(o.modes);
  if (idx.length < 2 * np)
    throw new ModeFitError(`only ${idx.length} usable bins between ${o.minHz} and ${o.maxHz} Hz for ${np} parameters`);
  const freqs = Float64Array.from(idx, (i) => frequencies[i]);
  const raw = Float64Array.from(idx, (i) => power[i]);
  const unit = [...raw].sort((a, b) => a - b)[Math.floor(raw.length / 2)];
  const data = raw.map((v) => v / unit);
  const rel = o.averages ? 1 / Math.sqrt(o.averages) : 1;

  o.guessHz.forEach((u, n) => {
    if (u + MODE_FREQUENCY_WINDOW_HZ < freqs[0] || u - MODE_FREQUENCY_WINDOW_HZ > freqs[freqs.length - 1]) {
      throw new ModeFitError(
        `mode ${n + 1} (near ${u} Hz) lies outside the fitted band ${freqs[0]}–${freqs[freqs.length - 1]} Hz; fit fewer modes or widen the band`,
      );
    }
  });
  const guess = initialGuess(freqs, data, o.guessHz);
  let two;
  try {
    two = twoStageLorentzianFit({
      modes: o.modes,
      freqs,
      data,
      rel,
      start: guess.start,
      lower: guess.lower,
      upper: guess.upper,
      lm: o.lm,
      shouldStop: o.shouldStop,
    });
  } catch (e) {
    if (e instanceof OptimInputError) throw new ModeFitError(`the fit could not start: ${e.message}`);
    throw e;
  }

  const { final } = two;
  const dof = freqs.length - np;
  const reduced = dof > 0 ? final.chi2 / dof : Infinity;
  const formal = covarianceFromJtJ(final.jtj, np, { scale: o.averages ? 1 : reduced });
  const scatter = { averages: o.averages ?? 1 / reduced, lagCorrelation: o.binCorrelation };
  const sens = {
    modes: o.modes,
    freqs,
    data,
    first: two.first.params,
    final: final.params,
    firstModel: two.firstModel,
    lower: guess.lower,
    upper: guess.upper,
  };
  const prop = scatter.averages > 0 && Number.isFinite(scatter.averages) ? propagatedFitCovariance(sens, scatter, idx) : null;
  const held = heldSet(final.params, o.modes, guess.lower, guess.upper);
  const sigma = (j: number) => (prop && !held[j] ? Math.sqrt(Math.max(0, prop[j * np + j])) : formal.stdErrors[j]);
  const p = final.params;
  // the covariance the errors come from: propagated, with the covariance's variance for a parameter held on a bound
  const cov = prop ? Float64Array.from(prop) : Float64Array.from(formal.covariance);
  if (prop) for (let j = 0; j < np; j++) if (held[j]) cov[j * np + j] = formal.covariance[j * np + j];
  const modes: FittedMode[] = [];
  for (let n = 0; n < o.modes; n++) {
    const [f, a, g] = [p[3 * n], p[3 * n + 1] * unit, p[3 * n + 2]];
    const ps = peakStatistics(p, cov, o.modes, n);
    modes.push({
      frequency: f,
      amplitude: a,
      halfWidth: g,
      q: f / (2 * g),
      peak: ps.peak * unit,
      errors: { frequency: sigma(3 * n), amplitude: sigma(3 * n + 1) * unit, halfWidth: sigma(3 * n + 2), lnPeak: ps.sdLnPeak },
      correlation: ps.correlation,
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
    ...(o.averages !== undefined ? { averages: o.averages } : {}),
    ...(o.binCorrelation?.length ? { binCorrelation: [...o.binCorrelation] } : {}),
    excluded: excludedRanges(frequencies, o.exclude, o.minHz, o.maxHz),
    converged,
    flags: [],
  };
  fit.flags = qualityOfFit(fit, { singular: formal.singular, lower: guess.lower, upper: guess.upper });
  return fit;
}
