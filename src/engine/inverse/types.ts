/**
 * Types of the inverse problem, defined once and shared by the CLI, the
 * worker and the UI: what goes in (data, unknowns, options) and what comes
 * out (minima of a run, an interval series, a misfit surface).
 */
import type { Component } from '@/src/engine/components';
import type { StopReason } from '@/src/engine/optim/types';
import type { WelchStatistics } from '@/src/engine/stats/welch-statistics';

/**
 * How a start ended: the optimiser's stop reason, or 'clustered' for a start stopped before its own search
 * because a start of lower misfit nearby leads into the same basin (multi-level single linkage, clustering.ts).
 */
export type StartStop = StopReason | 'clustered';

export type ParamKind = 'intensity' | 'lat' | 'lon' | 'spread';
export type Range = { min: number; max: number };

/** One region to find: each quantity fixed (a number) or free within a range. */
export interface RegionUnknown {
  name: string;
  /** C^2 km^2 / s; optimised as its logarithm. */
  intensity: number | Range;
  lat: number | Range;
  lon: number | Range;
  /** Angular spread in degrees (moving spot region); absent = point source. */
  spread?: number | Range;
  /**
   * A fixed footprint (e.g. grid cells): point nodes whose weights add up to 1, used
   * instead of the point or spot; lat and lon must then be fixed (they name its place).
   */
  footprint?: { lat: number; lon: number; weight: number }[];
}

export interface StationSite {
  code: string;
  lat: number;
  lon: number;
}

/**
 * One observed power spectrum (SI units) with what is known of its scatter: either the standard deviation of
 * ln(power), `sigmaLog`, or the Welch statistics of the spectrum, `welch`, which win when both are given: sigma
 * from K_eff, the log bias removed and neighbouring bins correlated (stats/, inverse/bin-whitening.ts).
 */
export interface ObservedSeries {
  station: string;
  component: Component;
  frequencies: ArrayLike<number>;
  power: ArrayLike<number>;
  sigmaLog?: number;
  welch?: WelchStatistics;
}

/** A frequency band left out of the misfit. */
export interface ExcludedBand {
  minHz: number;
  maxHz: number;
}

/** Which bins count: mains line and harmonics (± halfWidthHz), and user bands, are left out. */
export interface BinSelection {
  mainsHz?: number;
  mainsHalfWidthHz?: number;
  exclude?: ExcludedBand[];
}

/** One observed Schumann mode (from a Lorentzian fit) with its own sigmas. */
export interface ObservedMode {
  frequency: number;
  /** Peak power density of the mode, SI units of its component. */
  intensity: number;
  halfWidth: number;
  sigmaFrequency: number;
  /** Standard deviation of ln(intensity). */
  sigmaLogIntensity: number;
  sigmaHalfWidth: number;
  /**
   * Correlation (3x3) of (frequency, ln intensity, halfWidth), as a mode fit reports it; with the three sigmas it
   * gives the mode's covariance, which the misfit then uses (whitened per mode). Absent: independent errors.
   */
  correlation?: number[][];
}

export interface ObservedModes {
  station: string;
  component: Component;
  modes: ObservedMode[];
  /** Fitted modes (1-based, in frequency order) that were not trusted and left out, with the reason. */
  leftOut?: { mode: number; reason: string }[];
  /**
   * The mode fit these came from (modes fitted, band in Hz, default band when absent; lines whose bins it left out,
   * |f - frequencyHz| <= halfWidthHz, as line suppression marks them); the predicted modes go through the same fit.
   * Absent: the default fit of as many modes as the observed ones reach. `excludeRanges`: frequency ranges whose
   * bins it left out, as stored with the fit (modes/excluded-ranges.ts); bins in either are left out.
   * `exclusionsAssumed`: the observed fit did not record what it left out, and the lines are an assumption
   * (the station's mains and listed lines, which the pipeline leaves out of fits of time series).
   */
  fit?: {
    modes: number;
    minHz?: number;
    maxHz?: number;
    excludeLines?: { frequencyHz: number; halfWidthHz: number }[];
    excludeRanges?: { minHz: number; maxHz: number }[];
    exclusionsAssumed?: boolean;
  };
}

export interface SourceEstimate {
  name: string;
  lat: number;
  lon: number;
  intensity: number;
  spread?: number;
}

export interface NamedMatrix {
  names: string[];
  matrix: number[][];
}

/** A distinct minimum of the misfit. */
export interface Minimum {
  /** chi-square at the minimum. */
  misfit: number;
  /** misfit / (nData - nParams). */
  reducedChi2: number;
  /** Number of starts that ended here (failed starts join the nearest minimum). */
  count: number;
  /** Starts (indexes) that ended here. */
  startIndexes: number[];
  sources: SourceEstimate[];
  /** Free parameters in physical units (intensity in C^2 km^2/s, degrees). */
  params: Record<string, number>;
  /** Internal free vector (log intensity, unwrapped longitude), for warm starts and surfaces. */
  internal: number[];
  /** One-sigma errors per region and quantity (physical units; intensity by the delta method). */
  stdErrors: Record<string, Partial<Record<ParamKind, number>>>;
  correlation: NamedMatrix;
  resolution: NamedMatrix;
  /** J^T W J cannot be inverted: some parameter combination is not resolved by the data. */
  singular: boolean;
  rank: number;
  /** How the starts in this minimum stopped. */
  stopReasons: Partial<Record<StartStop, number>>;
}

/**
 * How each start ended, as columns of equal length in start order. Misfits
 * are null where the start ended on a non-finite chi-square (JSON has no NaN).
 */
export interface StartEnds {
  /** Start number (0-based), ascending. */
  index: number[];
  /** Final chi-square of the start itself (not of its minimum). */
  misfit: (number | null)[];
  /** Levenberg–Marquardt iterations the start took. */
  iterations: number[];
  stopReason: StartStop[];
  /** Rank (0-based, best first) of the minimum the start is counted in. */
  minimum: number[];
}

export interface InversionResult {
  starts: number;
  seed: number;
  seconds: number;
  nData: number;
  nParams: number;
  paramNames: string[];
  /** Starts that did not converge (counted within the minimum they ended nearest). */
  unconverged: number;
  minima: Minimum[];
  /** Each start's own end; absent from results stored before it was recorded. */
  startEnds?: StartEnds;
}

export interface InversionProgress {
  done: number;
  total: number;
  bestMisfit: number;
}

export interface InversionCallbacks {
  onProgress?: (p: InversionProgress) => void;
  shouldCancel?: () => boolean;
}

/** chi-square over a grid of two parameters. */
export interface MisfitSurface {
  xName: string;
  yName: string;
  x: number[];
  y: number[];
  /** misfit[iy][ix]. */
  misfit: number[][];
  mode: 'fixed' | 'profile';
}

export interface IntervalResult {
  index: number;
  result: InversionResult;
}
