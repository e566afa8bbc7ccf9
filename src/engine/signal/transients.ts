/**
 * Robust transient screen: nearby lightning, a passing vehicle or a spike makes
 * a segment's variance jump far above the rest of the interval. Segments whose
 * ln(variance) exceeds the interval median by more than both
 * `madFactor` robust sigmas (sigma = 1.4826 MAD, Hampel 1974, JASA 69, 383) and
 * ln(minRatio) are left out of the Welch average.
 */
import { TRANSIENT_MAD_FACTOR, TRANSIENT_MIN_RATIO } from '@/src/engine/tolerances';

export interface TransientOptions {
  madFactor: number;
  minRatio: number;
}

export function resolveTransientOptions(o: Partial<TransientOptions> = {}): TransientOptions {
  const r = { madFactor: o.madFactor ?? TRANSIENT_MAD_FACTOR, minRatio: o.minRatio ?? TRANSIENT_MIN_RATIO };
  if (!(r.madFactor > 0)) throw new RangeError(`transient madFactor must be positive, got ${r.madFactor}`);
  if (!(r.minRatio >= 1)) throw new RangeError(`transient minRatio must be at least 1, got ${r.minRatio}`);
  return r;
}

export interface TransientScreen {
  /** 1 = keep the segment; 0 = rejected or incomplete. */
  keep: Uint8Array;
  rejected: number;
  incomplete: number;
  /** ln(variance) above which a segment was rejected (NaN when no complete segment). */
  threshold: number;
}

function median(sorted: Float64Array): number {
  const n = sorted.length;
  return n % 2 ? sorted[(n - 1) / 2] : 0.5 * (sorted[n / 2 - 1] + sorted[n / 2]);
}

/** Decide per segment from its variance (NaN = segment with missing samples). */
export function screenTransients(variance: Float64Array, options: Partial<TransientOptions> = {}): TransientScreen {
  const o = resolveTransientOptions(options);
  const keep = new Uint8Array(variance.length);
  const logs: number[] = [];
  let incomplete = 0;
  for (const v of variance) {
    if (Number.isFinite(v)) logs.push(Math.log(Math.max(v, Number.MIN_VALUE)));
    else incomplete++;
  }
  if (logs.length === 0) return { keep, rejected: 0, incomplete, threshold: NaN };
  const sorted = Float64Array.from(logs).sort();
  const med = median(sorted);
  const dev = sorted.map((x) => Math.abs(x - med)).sort();
  const sigma = 1.4826 * median(dev);
  const threshold = med + Math.max(o.madFactor * sigma, Math.log(o.minRatio));
  let rejected = 0;
  for (let s = 0; s < variance.length; s++) {
    const v = variance[s];
    if (!Number.isFinite(v)) continue;
    if (Math.log(Math.max(v, Number.MIN_VALUE)) > threshold) rejected++;
    else keep[s] = 1;
  }
  return { keep, rejected, incomplete, threshold };
}
