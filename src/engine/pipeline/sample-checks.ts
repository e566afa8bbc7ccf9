/** Checks on raw samples: missing values and clipping. */

export function hasGaps(samples: ArrayLike<number>): boolean {
  for (let i = 0; i < samples.length; i++) if (!Number.isFinite(samples[i])) return true;
  return false;
}

/**
 * Share of samples that sit at the recorder's limit. With a known full scale,
 * samples with |x| >= fullScale count; without it, samples exactly equal to the
 * interval's largest or smallest value (a clipped recorder repeats its limit,
 * while a live analogue signal almost never repeats its extreme to the last bit).
 */
export function clippedShare(samples: ArrayLike<number>, fullScale: number | null): number {
  let n = 0;
  let count = 0;
  if (fullScale !== null) {
    for (let i = 0; i < samples.length; i++) {
      const v = samples[i];
      if (!Number.isFinite(v)) continue;
      n++;
      if (Math.abs(v) >= fullScale) count++;
    }
    return n ? count / n : 0;
  }
  let max = -Infinity;
  let min = Infinity;
  for (let i = 0; i < samples.length; i++) {
    const v = samples[i];
    if (!Number.isFinite(v)) continue;
    n++;
    if (v > max) max = v;
    if (v < min) min = v;
  }
  if (n === 0 || max === min) return 0;
  let atMax = 0;
  let atMin = 0;
  for (let i = 0; i < samples.length; i++) {
    if (samples[i] === max) atMax++;
    else if (samples[i] === min) atMin++;
  }
  // a single extreme sample is normal; repeats are what clipping looks like
  return (Math.max(0, atMax - 1) + Math.max(0, atMin - 1)) / n;
}
