/**
 * Inversion of a sequence of intervals (a day of 10-minute intervals is 144).
 * Each interval starts from the previous interval's minima (warm starts) plus
 * fresh quasi-random starts (seed + interval index), so slowly drifting
 * sources are tracked cheaply while new minima can still be found. A series
 * can resume at any interval index, given the result of the interval before
 * (the app's worker persists each finished interval through onInterval).
 */
import { InversionInputError } from './errors';
import { invertSpectra } from './invert';
import { INVERSION_DEFAULTS } from './defaults';
import type { MultiStartOptions } from './multistart-options';
import type { SpectrumInversionInput } from './interval-problem';
import type { InversionResult, IntervalResult } from './types';

export interface SeriesOptions extends Partial<MultiStartOptions> {
  /** First interval to invert (default 0). */
  fromIndex?: number;
  /** Result of interval fromIndex - 1 when resuming, to warm-start from. */
  previous?: InversionResult;
  /** At most this many previous minima are used as warm starts (default half the starts). */
  maxWarm?: number;
}

export interface SeriesCallbacks {
  /** Called with each finished interval, in order; awaited before the next one starts. */
  onInterval?: (r: IntervalResult) => void | Promise<void>;
  onProgress?: (p: { interval: number; intervals: number; startsDone: number; starts: number }) => void;
  shouldCancel?: () => boolean;
}

export async function invertSeries(
  intervals: SpectrumInversionInput[] | { length: number; get: (i: number) => SpectrumInversionInput },
  options: SeriesOptions = {},
  callbacks: SeriesCallbacks = {},
): Promise<{ results: IntervalResult[]; cancelled: boolean }> {
  const count = intervals.length;
  const get = Array.isArray(intervals) ? (i: number) => intervals[i] : intervals.get;
  const from = options.fromIndex ?? 0;
  if (!Number.isInteger(from) || from < 0 || from > count)
    throw new InversionInputError(`fromIndex must be within 0..${count}, got ${from}`);
  const starts = options.starts ?? INVERSION_DEFAULTS.seriesStarts;
  const seed = options.seed ?? INVERSION_DEFAULTS.seed;
  const maxWarm = options.maxWarm ?? Math.floor(starts / 2);
  let previous = options.previous;
  const results: IntervalResult[] = [];
  for (let index = from; index < count; index++) {
    if (callbacks.shouldCancel?.()) return { results, cancelled: true };
    const warm = (previous?.minima ?? []).slice(0, maxWarm).map((m) => m.internal);
    const result = await invertSpectra(
      get(index),
      { ...options, starts, seed: seed + index, warm },
      {
        shouldCancel: callbacks.shouldCancel,
        onProgress: (p) => callbacks.onProgress?.({ interval: index, intervals: count, startsDone: p.done, starts: p.total }),
      },
    );
    // An interval interrupted by cancellation is not reported; a resume redoes it.
    if (callbacks.shouldCancel?.()) return { results, cancelled: true };
    const r = { index, result };
    results.push(r);
    await callbacks.onInterval?.(r);
    previous = result;
  }
  return { results, cancelled: false };
}
