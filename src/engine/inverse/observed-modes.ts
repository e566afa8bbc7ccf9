/**
 * Observed modes of one spectrum for a mode-parameter inversion: the
 * pipeline's Lorentzian fit (fitModes), each usable mode with its peak
 * (amplitude plus background at the mode frequency) and with errors
 * propagated from the bin scatter through that same estimator (first-order
 * delta method, sigma_q^2 = sum_k (dq/dy_k)^2 var(y_k) with var(y_k) =
 * (sigmaLog y_k)^2 for independent bins; dq/dy from fit-sensitivity.ts).
 * Unlike the fit's covariance (J^T W J)^-1 these errors stay right when the
 * spectrum is not exactly Lorentzian and the weights depend on the data.
 * Modes left out: a zero amplitude or a peak that is not positive, a frequency on the edge of
 * its window or a half-width on its bounds (the fit did not find a
 * resonance there).
 */
import { fitModes } from '@/src/engine/modes/fit-modes';
import { MODE_HALF_WIDTH_MAX_HZ, MODE_HALF_WIDTH_MIN_HZ } from '@/src/engine/tolerances';
import { modeSeriesSetup, predictedModeDerivatives, predictedSeriesModes } from './predicted-modes';
import type { ObservedMode, ObservedModes, ObservedSeries } from './types';

export interface ObservedModeOptions {
  /** Modes to fit (3–7). */
  modes: number;
  minHz?: number;
  maxHz?: number;
}

const EDGE_HZ = 1e-6;

export function observedModesOf(series: ObservedSeries, options: ObservedModeOptions): ObservedModes {
  const grid = Float64Array.from(series.frequencies);
  const fit = fitModes(grid, series.power, { modes: options.modes, minHz: options.minHz, maxHz: options.maxHz, averages: 1 / series.sigmaLog ** 2 });
  const all: ObservedModes = {
    station: series.station,
    component: series.component,
    modes: fit.modes.map((m) => ({ frequency: m.frequency, intensity: m.amplitude + fit.background.b0 + fit.background.b1 * m.frequency, halfWidth: m.halfWidth, sigmaFrequency: 1, sigmaLogIntensity: 1, sigmaHalfWidth: 1 })),
    fit: { modes: options.modes, ...fit.band },
  };
  const setup = modeSeriesSetup(all, grid, `${series.station} ${series.component}`);
  const power = Float64Array.from(setup.bins, (b) => series.power[b]);
  const est = predictedSeriesModes(setup, power);
  const nb = power.length;
  const d = new Float64Array(nb * nb);
  for (let k = 0; k < nb; k++) d[k * nb + k] = series.sigmaLog * power[k];
  const rows = new Float64Array(3 * all.modes.length * nb);
  predictedModeDerivatives(setup, est, d, nb, rows);
  const sd = (row: number) => Math.sqrt(rows.subarray(row * nb, (row + 1) * nb).reduce((a, v) => a + v * v, 0));
  const keep: ObservedMode[] = [];
  all.modes.forEach((m, k) => {
    const s = 3 * setup.slots[k];
    const onEdge = Math.abs(m.frequency - est.lower[s]) < EDGE_HZ || Math.abs(m.frequency - est.upper[s]) < EDGE_HZ
      || Math.abs(m.halfWidth - MODE_HALF_WIDTH_MIN_HZ) < EDGE_HZ || Math.abs(m.halfWidth - MODE_HALF_WIDTH_MAX_HZ) < EDGE_HZ;
    const sigma = [sd(3 * k), sd(3 * k + 1), sd(3 * k + 2)];
    if (onEdge || !(fit.modes[k].amplitude > 0) || !(m.intensity > 0) || !sigma.every((v) => v > 0 && Number.isFinite(v))) return;
    keep.push({ ...m, sigmaFrequency: sigma[0], sigmaLogIntensity: sigma[1], sigmaHalfWidth: sigma[2] });
  });
  return { ...all, modes: keep };
}
