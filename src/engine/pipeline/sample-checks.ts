/** Checks on raw samples: missing values and clipping. */

export function hasGaps(samples: ArrayLike<number>): boolean {
  for (let i = 0; i < samples.length; i++) if (!Number.isFinite(samples[i])) return true;
  return false;
}

/**
 * Share of samples that sit at the recorder's limit. With a known full scale,
 * samples with |x| >= fullScale count; without it, samples that repeat the
 * interval's largest or smallest value in runs of two or more (a clipped
 * recorder stays on its rail for consecutive samples, while coarsely quantised
 * live noise touches its extreme only now and then).
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
  for (let i = 0; i < samples.length; i++) {
    const v = samples[i];
    if (v !== max && v !== min) continue;
    if ((i > 0 && samples[i - 1] === v) || (i + 1 < samples.length && samples[i + 1] === v)) count++;
  }
  return count / n;
}
