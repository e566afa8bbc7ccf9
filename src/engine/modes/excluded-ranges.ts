/**
 * The frequency ranges a mode fit left out, as it stores them: each run of
 * consecutive left-out bins inside the band becomes one range from its first
 * to its last bin's frequency. A fit of the same band on the same grid that
 * leaves out every bin inside these ranges (within EXCLUDED_RANGE_SLACK_HZ)
 * uses exactly the same bins.
 */
import { EXCLUDED_RANGE_SLACK_HZ } from '@/src/engine/tolerances';
import type { ExcludedRange } from './types';

/** Runs of bins with `exclude[i]` set and minHz <= f <= maxHz, in increasing order. */
export function excludedRanges(
  frequencies: ArrayLike<number>,
  exclude: ArrayLike<number> | undefined,
  minHz: number,
  maxHz: number,
): ExcludedRange[] {
  const out: ExcludedRange[] = [];
  if (!exclude) return out;
  let open: ExcludedRange | null = null;
  for (let i = 0; i < frequencies.length; i++) {
    const f = frequencies[i];
    const inBand = f >= minHz && f <= maxHz;
    if (inBand && exclude[i]) {
      if (open) open.maxHz = f;
      else out.push((open = { minHz: f, maxHz: f }));
    } else open = null;
  }
  return out;
}

/** Whether frequency f lies in one of the ranges (their ends widened by EXCLUDED_RANGE_SLACK_HZ against rounding). */
export function inExcludedRange(f: number, ranges: readonly ExcludedRange[]): boolean {
  return ranges.some((r) => f >= r.minHz - EXCLUDED_RANGE_SLACK_HZ && f <= r.maxHz + EXCLUDED_RANGE_SLACK_HZ);
}
