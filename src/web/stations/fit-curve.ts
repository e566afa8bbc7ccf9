/**
 * The fitted Lorentzian-plus-background curve as a figure draws it: only over the band the fit was
 * made on (a fit says nothing outside it; beyond the band a linear background can even fall below
 * zero), and only where the model power is positive (a log axis cannot show the rest).
 */
import { lorentzianModel } from '@/src/engine/modes/lorentzian';

export interface CurveFit {
  modes: { frequency: number; amplitude: number; halfWidth: number }[];
  background: { b0: number; b1: number };
  band?: { minHz: number; maxHz: number };
}

/** The engine's parameter vector [f_1, A_1, g_1, ..., b0, b1] of a stored fit. */
function fitParams(fit: CurveFit): number[] {
  return [...fit.modes.flatMap((m) => [m.frequency, m.amplitude, m.halfWidth]), fit.background.b0, fit.background.b1];
}

/** Model power at each frequency, b0 + b1 f + sum of A / (1 + ((f - f_n) / g_n)^2), by the engine's own function. */
export function fitModel(fit: CurveFit, frequencies: readonly number[]): Float64Array {
  const out = new Float64Array(frequencies.length);
  lorentzianModel(fitParams(fit), fit.modes.length, frequencies, out);
  return out;
}

/** The band the curve is drawn over: the recorded one, else the modes' frequencies ± 3 half-widths (older fits). */
export function fittedBand(fit: CurveFit): { minHz: number; maxHz: number } | null {
  if (fit.band) return fit.band;
  if (!fit.modes.length) return null;
  return {
    minHz: Math.min(...fit.modes.map((m) => m.frequency - 3 * m.halfWidth)),
    maxHz: Math.max(...fit.modes.map((m) => m.frequency + 3 * m.halfWidth)),
  };
}

/** Points (f, model power) at the given frequencies inside the fitted band, positive power only. */
export function fittedCurve(fit: CurveFit, frequencies: number[]): { f: number; p: number }[] {
  const band = fittedBand(fit);
  if (!band) return [];
  const inside = frequencies.filter((f) => f >= band.minHz && f <= band.maxHz);
  const power = fitModel(fit, inside);
  return inside.map((f, i) => ({ f, p: power[i] })).filter((d) => d.p > 0);
}

/**
 * Standard error of Q = f / (2 g) from those of the mode frequency f and half-width g by first-order
 * propagation, their correlation neglected: sigma_Q = Q sqrt((sigma_f / f)^2 + (sigma_g / g)^2)
 * (common practice; e.g. Taylor, An Introduction to Error Analysis, §3.8). NaN when an error is missing.
 */
export function qFactorError(m: {
  frequency: number;
  halfWidth: number;
  errors: { frequency: number; halfWidth: number };
}): number {
  const q = m.frequency / (2 * m.halfWidth);
  return q * Math.hypot(m.errors.frequency / m.frequency, m.errors.halfWidth / m.halfWidth);
}
