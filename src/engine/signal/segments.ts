/**
 * Segment layout of Welch's method (Welch 1967, IEEE Trans. Audio
 * Electroacoust. 15, 70): segments of `length` samples starting every
 * `length - overlap` samples; a trailing remainder shorter than a segment is
 * not used (as scipy.signal.welch does by default).
 */
export interface SegmentLayout {
  length: number;
  step: number;
  count: number;
}

export function segmentLayout(nSamples: number, length: number, overlap = Math.floor(length / 2)): SegmentLayout {
  if (!Number.isInteger(length) || length < 2)
    throw new RangeError(`segment length must be a whole number of at least 2 samples, got ${length}`);
  if (!Number.isInteger(overlap) || overlap < 0 || overlap >= length) {
    throw new RangeError(`segment overlap must be a whole number from 0 to ${length - 1} samples, got ${overlap}`);
  }
  const step = length - overlap;
  const count = nSamples < length ? 0 : Math.floor((nSamples - length) / step) + 1;
  return { length, step, count };
}

export interface SegmentStats {
  /** Variance of each segment about its own mean (NaN when the segment holds a non-finite sample). */
  variance: Float64Array;
  /** 1 when every sample of the segment is finite. */
  complete: Uint8Array;
}

/** Per-segment variance, the statistic the transient screen works on. */
export function segmentStats(samples: ArrayLike<number>, layout: SegmentLayout): SegmentStats {
  const variance = new Float64Array(layout.count);
  const complete = new Uint8Array(layout.count);
  for (let s = 0; s < layout.count; s++) {
    const start = s * layout.step;
    let sum = 0;
    let finite = true;
    for (let j = 0; j < layout.length; j++) {
      const v = samples[start + j];
      if (!Number.isFinite(v)) {
        finite = false;
        break;
      }
      sum += v;
    }
    if (!finite) {
      variance[s] = NaN;
      continue;
    }
    const mean = sum / layout.length;
    let ss = 0;
    for (let j = 0; j < layout.length; j++) {
      const d = samples[start + j] - mean;
      ss += d * d;
    }
    variance[s] = ss / layout.length;
    complete[s] = 1;
  }
  return { variance, complete };
}
