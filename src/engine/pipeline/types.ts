/**
 * Types of the per-interval processing, shared by the worker, the command
 * line and the interface.
 */
import type { Calibration } from '@/src/engine/signal/calibration';
import type { TransientOptions } from '@/src/engine/signal/transients';
import type { ModeFit } from '@/src/engine/modes/types';
import type { WelchStatistics } from '@/src/engine/stats/welch-statistics';

/** How one station component's samples are turned into a spectrum and a fit. */
export interface ProcessingConfig {
  sampleRateHz: number;
  /** Welch segment length in seconds (default 10). */
  segmentSeconds?: number;
  /** Mains frequency (50 or 60 Hz); its line and harmonics are suppressed. null/undefined: none. */
  mainsHz?: number | null;
  /** Further fixed interference lines to suppress. */
  interferenceLines?: { frequencyHz: number; halfWidthHz?: number }[];
  /** Raw units to physical units (default: gain 1, the samples are already physical). */
  calibration?: Calibration;
  /** Band of the kept spectrum (default 3–48 Hz). */
  band?: { minHz: number; maxHz: number };
  /** Modes to fit, 3–7 (default 5); 0 skips the fit. */
  modes?: number;
  /** Recorder full scale in raw units; samples at or beyond it count as clipped. */
  fullScale?: number;
  transient?: Partial<TransientOptions>;
}

/**
 * Interval quality flags: 'gaps' (missing samples), 'too-much-rejected' (over half the segments
 * rejected or missing), 'clipping' (samples stuck at full scale), 'calibration-range' (band outside the
 * response table), 'no-data' (no usable segment), 'fit-failed', 'implausible-modes'.
 */
export type IntervalFlag =
  'gaps' | 'too-much-rejected' | 'clipping' | 'calibration-range' | 'no-data' | 'fit-failed' | 'implausible-modes';

export interface IntervalResult {
  /** Calibrated one-sided PSD inside the band, lines suppressed; null when no segment was usable. */
  spectrum: { frequencies: number[]; power: number[] } | null;
  /** Welch segments averaged. */
  segments: number;
  /** Welch statistics of the spectrum (segments averaged, window, overlap, K_eff); null when no segment was usable. */
  welch: WelchStatistics | null;
  /** Share of the interval's segments left out (transients rejected or samples missing), 0–1. */
  rejectedShare: number;
  fit: ModeFit | null;
  flags: IntervalFlag[];
}
