/**
 * Observed modes of one spectrum for a mode-parameter inversion: the
 * pipeline's Lorentzian fit (fitModes), each usable mode with its peak
 * (amplitude plus background at the mode frequency) and with errors
 * propagated from the bin scatter through that same estimator: dq/dy from
 * fit-sensitivity.ts, cov(q) = G V G^T by modes/bin-scatter.ts, the one
 * propagation fitModes' own errors go through (modes/fit-errors.ts); here
 * q holds the observables, ln peak among them.
 * Modes left out, each with its reason in `leftOut`: a zero amplitude or a peak that is not positive, a
 * frequency on the edge of its window or a half-width on its bounds (the fit did not find a resonance
 * there), a Q-factor outside MODE_Q_MIN–MODE_Q_MAX; every mode of a fit that did not converge.
 */
import { propagateBinScatter, welchScatter, type BinScatter } from '@/src/engine/modes/bin-scatter';
import { fitModes } from '@/src/engine/modes/fit-modes';
import { MODE_HALF_WIDTH_MAX_HZ, MODE_HALF_WIDTH_MIN_HZ, MODE_Q_MAX, MODE_Q_MIN } from '@/src/engine/tolerances';
import { modeSeriesSetup, predictedModeDerivatives, predictedSeriesModes } from './predicted-modes';
import type { ObservedMode, ObservedModes, ObservedSeries } from './types';

export interface ObservedModeOptions {
  /** Modes to fit (3–7). */
  modes: number;
  minHz?: number;
  maxHz?: number;
}

const EDGE_HZ = 1e-6;

export interface PropagatedErrors {
  /** Per observed mode: sigma of frequency, ln peak and half-width (0 where the fit holds the quantity on a bound). */
  sigmas: [number, number, number][];
  /** Per observed mode: the fit holds its frequency or half-width on a bound, or found no amplitude. */
  onEdge: boolean[];
  /** Per observed mode: correlation (3x3) of its frequency, ln peak and half-width (0 off the diagonal where a sigma is 0). */
  correlations: number[][][];
}

/**
 * Errors of the observed modes of `power` (on `grid`, the spectrum's own bins) propagated from the bins'
 * scatter (e.g. welchScatter of the spectrum's Welch statistics) through the fit described by
 * `modes.fit` (the pipeline's estimator).
 */
export function propagatedModeErrors(
  modes: ObservedModes,
  grid: Float64Array,
  power: ArrayLike<number>,
  scatter: BinScatter,
): PropagatedErrors {
  const setup = modeSeriesSetup(modes, grid, `${modes.station} ${modes.component}`);
  const y = Float64Array.from(setup.bins, (b) => power[b]);
  const est = predictedSeriesModes(setup, y);
  const nb = y.length;
  const nq = 3 * modes.modes.length;
  const rows = new Float64Array(nq * nb);
  predictedModeDerivatives(setup, est, null, nb, rows);
  const cov = propagateBinScatter(rows, nq, y, scatter, setup.bins);
  const sd = (row: number) => Math.sqrt(Math.max(0, cov[row * nq + row]));
  const q = est.fit.final.params;
  return {
    sigmas: modes.modes.map((_, k) => [sd(3 * k), sd(3 * k + 1), sd(3 * k + 2)]),
    correlations: modes.modes.map((_, k) =>
      [0, 1, 2].map((a) =>
        [0, 1, 2].map((b) => {
          if (a === b) return 1;
          const s = sd(3 * k + a) * sd(3 * k + b);
          return s > 0 ? cov[(3 * k + a) * nq + 3 * k + b] / s : 0;
        }),
      ),
    ),
    onEdge: setup.slots.map((s) => {
      const f = q[3 * s],
        g = q[3 * s + 2];
      return (
        !(q[3 * s + 1] > 0) ||
        Math.abs(f - est.lower[3 * s]) < EDGE_HZ ||
        Math.abs(f - est.upper[3 * s]) < EDGE_HZ ||
        Math.abs(g - MODE_HALF_WIDTH_MIN_HZ) < EDGE_HZ ||
        Math.abs(g - MODE_HALF_WIDTH_MAX_HZ) < EDGE_HZ
      );
    }),
  };
}

/** The bins' scatter a series states: from its Welch statistics (K_eff and the Hann bin correlation), else 1/sigmaLog^2 independent averages. */
export function seriesScatter(series: ObservedSeries): BinScatter {
  if (series.welch) return welchScatter(series.welch);
  if (!(series.sigmaLog! > 0)) throw new RangeError(`${series.station} ${series.component}: sigmaLog or welch is required`);
  return { averages: 1 / series.sigmaLog! ** 2 };
}

export function observedModesOf(series: ObservedSeries, options: ObservedModeOptions): ObservedModes {
  const grid = Float64Array.from(series.frequencies);
  const scatter = seriesScatter(series);
  const fit = fitModes(grid, series.power, {
    modes: options.modes,
    minHz: options.minHz,
    maxHz: options.maxHz,
    averages: scatter.averages,
    binCorrelation: scatter.lagCorrelation,
  });
  const all: ObservedModes = {
    station: series.station,
    component: series.component,
    modes: fit.modes.map((m) => ({
      frequency: m.frequency,
      intensity: m.amplitude + fit.background.b0 + fit.background.b1 * m.frequency,
      halfWidth: m.halfWidth,
      sigmaFrequency: 1,
      sigmaLogIntensity: 1,
      sigmaHalfWidth: 1,
    })),
    fit: { modes: options.modes, ...fit.band },
  };
  // a fit that did not reach a minimum (or whose covariance is singular) is not trusted: every mode left out
  if (fit.flags.includes('fit-failed'))
    return { ...all, modes: [], leftOut: all.modes.map((_, k) => ({ mode: k + 1, reason: 'the fit did not converge' })) };
  const { sigmas, onEdge, correlations } = propagatedModeErrors(all, grid, series.power, scatter);
  const keep: ObservedMode[] = [];
  const leftOut: { mode: number; reason: string }[] = [];
  all.modes.forEach((m, k) => {
    const sigma = sigmas[k];
    const q = fit.modes[k].q;
    const reason = onEdge[k]
      ? 'frequency or half-width on a bound of the fit, or no amplitude'
      : !(m.intensity > 0)
        ? 'the peak is not positive'
        : !sigma.every((v) => v > 0 && Number.isFinite(v))
          ? 'no finite error'
          : !(q >= MODE_Q_MIN && q <= MODE_Q_MAX)
            ? `Q-factor ${q.toFixed(2)} outside ${MODE_Q_MIN}–${MODE_Q_MAX}`
            : null;
    if (reason) {
      leftOut.push({ mode: k + 1, reason });
      return;
    }
    keep.push({
      ...m,
      sigmaFrequency: sigma[0],
      sigmaLogIntensity: sigma[1],
      sigmaHalfWidth: sigma[2],
      correlation: correlations[k],
    });
  });
  return { ...all, modes: keep, ...(leftOut.length ? { leftOut } : {}) };
}
