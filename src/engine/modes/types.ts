/**
 * Result types of a Lorentzian mode fit, shared by the command line, the
 * worker and the interface. Model (Ondrášková et al. 2007, Radio Science 42):
 *   P(f) = sum_n A_n / (1 + ((f - f_n) / g_n)^2) + b0 + b1 f,
 * g_n the half-width at half maximum, Q_n = f_n / (2 g_n).
 */

export interface FittedMode {
  frequency: number;
  amplitude: number;
  halfWidth: number;
  q: number;
  /** Fitted model PSD at the mode's centre, amplitude plus background, A + b0 + b1 f (absent from fits stored before it was reported). */
  peak?: number;
  /**
   * One-standard-deviation errors: the bins' scatter propagated through the fit (fit-errors.ts); `lnPeak`, of ln peak
   * from the full parameter covariance, background included (modes/peak-statistics.ts).
   */
  errors: { frequency: number; amplitude: number; halfWidth: number; lnPeak?: number };
  /** Correlation of (frequency, ln peak, halfWidth), 3x3, from the same covariance. */
  correlation?: number[][];
}

/** Quality flags a fit can raise (names shared with the interval flags). */
export type FitFlag = 'fit-failed' | 'implausible-modes';

/** A frequency range whose bins a fit left out: from the first to the last left-out bin of a run of them, in Hz. */
export interface ExcludedRange {
  minHz: number;
  maxHz: number;
}

export interface ModeFit {
  modes: FittedMode[];
  background: { b0: number; b1: number };
  /** chi-square of the final weighted fit. */
  misfit: number;
  /** Bins used minus parameters. */
  dof: number;
  /** The band the fit used (bins outside it are not fitted). */
  band: { minHz: number; maxHz: number };
  /** Equivalent independent averages behind each bin that the errors assume, when given (absent: estimated from the misfit). */
  averages?: number;
  /** Correlation of neighbouring bins' power the errors assume, when given (absent: independent bins). */
  binCorrelation?: number[];
  /** Runs of bins inside the band that the fit left out (bridged interference lines), in increasing order; empty when none. */
  excluded: ExcludedRange[];
  converged: boolean;
  flags: FitFlag[];
}

/** Parameter vector layout: [f_1, A_1, g_1, ..., f_N, A_N, g_N, b0, b1]. */
export const PARAMS_PER_MODE = 3;
export const paramCount = (modes: number) => PARAMS_PER_MODE * modes + 2;
