/**
 * The observed modes' estimator applied to a predicted spectrum: for each
 * observed series, the same Lorentzian-plus-linear-background fit the
 * pipeline ran on the observed spectrum (same number of modes, same band,
 * same usual-frequency windows and bounds, same starting values from
 * initialGuess, same two weighted passes and optimiser settings:
 * two-stage-fit.ts), run on the predicted power of the grid bins in that
 * band less those the observed fit left out (interference lines, or the
 * ranges stored with the fit), each
 * pass then taken to full precision by a few Newton steps. Each observed
 * mode is matched to the fitted mode of its window (the usual frequency it
 * lies nearest to; the windows do not overlap).
 *
 * Not warm-started from the observed modes: the fit of a forward-model
 * spectrum has several local minima (a narrow spike on a bound, one broad
 * mode for two), and a start at the observed modes can end in a different
 * one than the pipeline's own start, which would make a different estimator.
 *
 * Reported per observed mode, as the observations are: frequency, ln of the
 * peak (amplitude plus background at the mode frequency) and half-width,
 * with their derivatives with respect to the source parameters by implicit
 * differentiation of the fit (fit-sensitivity.ts). The peak is floored
 * smoothly (PREDICTED_PEAK_FLOOR) so that ln(peak) stays finite where the
 * predicted spectrum shows no peak; a mode the fit does not find (amplitude
 * held at zero) reads as the observed one in frequency and half-width. The fit
 * is bounded, so every output is finite for any positive spectrum.
 */
import { fitSensitivity } from '@/src/engine/modes/fit-sensitivity';
import { inExcludedRange } from '@/src/engine/modes/excluded-ranges';
import { initialGuess } from '@/src/engine/modes/initial-guess';
import { ModeFitOptionError, resolveModeFitOptions } from '@/src/engine/modes/options';
import { twoStageLorentzianFit, type TwoStageResult } from '@/src/engine/modes/two-stage-fit';
import { MAX_MODES, MIN_MODES, USUAL_MODE_FREQUENCIES_HZ } from '@/src/engine/modes/usual-modes';
import { paramCount } from '@/src/engine/modes/types';
import { MODE_FREQUENCY_WINDOW_HZ, PREDICTED_MODE_NEWTON_STEPS, PREDICTED_PEAK_FLOOR } from '@/src/engine/tolerances';
import type { LmOptions } from '@/src/engine/optim/types';
import { InversionInputError } from './errors';
import type { ObservedModes } from './types';

/** How one observed series' modes are re-estimated from a predicted spectrum (fixed for a run). */
export interface ModeSeriesSetup {
  /** Grid indexes of the fitted bins. */
  bins: Int32Array;
  freqs: Float64Array;
  modes: number;
  guessHz: number[];
  /** Fitted-mode slot of each observed mode. */
  slots: number[];
  /** The pipeline fit's optimiser settings. */
  lm: Partial<LmOptions>;
  /** Observed frequency and half-width per observed mode. */
  observed: { frequency: number; halfWidth: number }[];
}

/** The fit of one predicted spectrum and the per-observed-mode values (frequency, ln peak, half-width). */
export interface PredictedSeriesModes {
  /** The median fitted power (the fit's unit) and its bin. */
  unit: number;
  medianBin: number;
  data: Float64Array;
  lower: Float64Array;
  upper: Float64Array;
  fit: TwoStageResult;
  /** 3 per observed mode: frequency (Hz), ln peak (SI), half-width (Hz). */
  values: Float64Array;
}

function slotOf(f: number): number {
  let best = 0;
  USUAL_MODE_FREQUENCIES_HZ.forEach((u, k) => {
    if (Math.abs(f - u) < Math.abs(f - USUAL_MODE_FREQUENCIES_HZ[best])) best = k;
  });
  return best;
}

export function modeSeriesSetup(m: ObservedModes, grid: Float64Array, where: string): ModeSeriesSetup {
  const slots = m.modes.map((md, k) => {
    const s = slotOf(md.frequency);
    if (Math.abs(md.frequency - USUAL_MODE_FREQUENCIES_HZ[s]) > MODE_FREQUENCY_WINDOW_HZ * (1 + 1e-9)) {
      throw new InversionInputError(
        `${where}.modes[${k}]: ${md.frequency} Hz lies in no mode window (usual frequency ± ${MODE_FREQUENCY_WINDOW_HZ} Hz)`,
      );
    }
    return s;
  });
  slots.forEach((s, k) => {
    if (slots.indexOf(s) !== k)
      throw new InversionInputError(`${where}.modes[${k}]: two observed modes lie in the window of mode ${s + 1}`);
  });
  const modes = m.fit?.modes ?? Math.min(MAX_MODES, Math.max(MIN_MODES, Math.max(...slots) + 1));
  let o;
  try {
    o = resolveModeFitOptions({ modes, minHz: m.fit?.minHz, maxHz: m.fit?.maxHz }, grid);
  } catch (e) {
    if (e instanceof ModeFitOptionError) throw new InversionInputError(`${where}.fit: ${e.message}`);
    throw e;
  }
  slots.forEach((s, k) => {
    if (s >= modes) throw new InversionInputError(`${where}.modes[${k}]: mode ${s + 1} was not among the ${modes} fitted modes`);
  });
  const top = grid[grid.length - 1];
  if (o.minHz < grid[0] - 1e-9 || o.maxHz > top + 1e-9) {
    throw new InversionInputError(
      `${where}.fit: the fitted band ${o.minHz}–${o.maxHz} Hz reaches outside the model grid ${grid[0]}–${top} Hz`,
    );
  }
  // Bins the observed fit left out (bridged interference lines): by line suppression's own rule for lines,
  // the stored runs of left-out bins for ranges.
  const lines = m.fit?.excludeLines ?? [];
  const ranges = m.fit?.excludeRanges ?? [];
  const left = (f: number) => lines.some((l) => Math.abs(f - l.frequencyHz) <= l.halfWidthHz) || inExcludedRange(f, ranges);
  const idx: number[] = [];
  for (let i = 0; i < grid.length; i++) if (grid[i] >= o.minHz && grid[i] <= o.maxHz && !left(grid[i])) idx.push(i);
  const np = paramCount(modes);
  if (idx.length < 2 * np)
    throw new InversionInputError(
      `${where}: only ${idx.length} grid bins between ${o.minHz} and ${o.maxHz} Hz for a fit of ${modes} modes`,
    );
  const freqs = Float64Array.from(idx, (i) => grid[i]);
  o.guessHz.forEach((u, n) => {
    if (u + MODE_FREQUENCY_WINDOW_HZ < freqs[0] || u - MODE_FREQUENCY_WINDOW_HZ > freqs[freqs.length - 1]) {
      throw new InversionInputError(
        `${where}: mode ${n + 1} (near ${u} Hz) lies outside the grid's part of the fitted band, ${freqs[0]}–${freqs[freqs.length - 1]} Hz`,
      );
    }
  });
  return {
    bins: Int32Array.from(idx),
    freqs,
    modes,
    guessHz: o.guessHz,
    slots,
    lm: o.lm,
    observed: m.modes.map((md) => ({ frequency: md.frequency, halfWidth: md.halfWidth })),
  };
}

/** C1 floor: x (x >= 2m), m (1 + exp(x/m - 2)) below; value and derivative. */
function softFloor(x: number, m: number): [number, number] {
  if (x >= 2 * m) return [x, 1];
  const e = Math.exp(x / m - 2);
  return [m * (1 + e), e];
}

/** Fit the predicted power of the setup's bins (raw SI values) and read off the observed modes' counterparts. */
export function predictedSeriesModes(setup: ModeSeriesSetup, power: ArrayLike<number>): PredictedSeriesModes {
  const raw = Float64Array.from(power);
  const medianBin = [...raw.keys()].sort((a, b) => raw[a] - raw[b])[Math.floor(raw.length / 2)];
  const unit = raw[medianBin];
  const data = raw.map((v) => v / unit);
  const guess = initialGuess(setup.freqs, data, setup.guessHz);
  const fit = twoStageLorentzianFit({
    modes: setup.modes,
    freqs: setup.freqs,
    data,
    rel: 1,
    start: guess.start,
    lower: guess.lower,
    upper: guess.upper,
    lm: setup.lm,
    polish: PREDICTED_MODE_NEWTON_STEPS,
  });
  const q = fit.final.params;
  const b0 = 3 * setup.modes;
  const values = new Float64Array(3 * setup.slots.length);
  setup.slots.forEach((s, k) => {
    const f = q[3 * s];
    const [peak] = softFloor(q[3 * s + 1] + q[b0] + q[b0 + 1] * f, PREDICTED_PEAK_FLOOR);
    // No mode found (amplitude held at zero): frequency and half-width are undetermined; read them as the observed ones.
    const absent = !(q[3 * s + 1] > 0);
    values.set(
      [absent ? setup.observed[k].frequency : f, Math.log(peak * unit), absent ? setup.observed[k].halfWidth : q[3 * s + 2]],
      3 * k,
    );
  });
  return { unit, medianBin, data, lower: guess.lower, upper: guess.upper, fit, values };
}

/**
 * Derivatives of the values (3 per observed mode, row-major x n) with respect to the source
 * parameters, given d(power of the setup's bins)/dp (raw SI, nb x n row-major); dPowerDp null gives
 * the derivatives with respect to the bins' power itself (n = nb).
 */
export function predictedModeDerivatives(
  setup: ModeSeriesSetup,
  est: PredictedSeriesModes,
  dPowerDp: ArrayLike<number> | null,
  n: number,
  out: Float64Array,
): void {
  const nbins = setup.freqs.length;
  let dy: Float64Array | null = null;
  if (dPowerDp) {
    dy = new Float64Array(nbins * n);
    for (let i = 0; i < nbins * n; i++) dy[i] = dPowerDp[i] / est.unit;
  }
  const { fit } = est;
  const dq = fitSensitivity(
    {
      modes: setup.modes,
      freqs: setup.freqs,
      data: est.data,
      first: fit.first.params,
      final: fit.final.params,
      firstModel: fit.firstModel,
      lower: est.lower,
      upper: est.upper,
    },
    dy,
    n,
  );
  // dq/dy of the normalised data, y = power / unit: dq/dpower = dq/dy / unit.
  if (!dy) for (let i = 0; i < dq.length; i++) dq[i] /= est.unit;
  const q = fit.final.params;
  const b0 = 3 * setup.modes;
  // The floor is a fixed fraction of the median power, so where it acts ln(peak) follows d ln(median)/dp too:
  // d ln(unit F(x)) = (1 - F'(x) x / F(x)) d ln(unit) + F'(x) dx / F(x), x the peak in units of the median.
  const dLnUnit = dy ? dy.subarray(est.medianBin * n, (est.medianBin + 1) * n) : new Float64Array(n);
  if (!dy) dLnUnit[est.medianBin] = 1 / est.unit;
  setup.slots.forEach((s, k) => {
    const f = q[3 * s];
    const x = q[3 * s + 1] + q[b0] + q[b0 + 1] * f;
    const [peak, slope] = softFloor(x, PREDICTED_PEAK_FLOOR);
    const present = q[3 * s + 1] > 0 ? 1 : 0;
    for (let j = 0; j < n; j++) {
      const df = dq[3 * s * n + j] * present;
      const dPeak = dq[(3 * s + 1) * n + j] + dq[b0 * n + j] + f * dq[(b0 + 1) * n + j] + q[b0 + 1] * df;
      out[3 * k * n + j] = df;
      out[(3 * k + 1) * n + j] = (slope * dPeak) / peak + (1 - (slope * x) / peak) * dLnUnit[j];
      out[(3 * k + 2) * n + j] = dq[(3 * s + 2) * n + j] * present;
    }
  });
}
