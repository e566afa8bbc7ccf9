/**
 * What a Welch spectrum knows about its own scatter: the segments actually
 * averaged (after transient rejection), the window, the overlap, and the
 * equivalent number of independent averages K_eff. Each bin of a Welch
 * estimate is about P chi-square(2 K_eff) / (2 K_eff) (Bendat & Piersol,
 * Random Data, §8.5). Overlapping segments are not independent; with the
 * window's overlap correlation rho(d) = sum w_t w_{t+d step} / sum w_t^2,
 *   K_eff = K^2 / sum_{a,b averaged} rho(|a - b|)^2,
 * which for K contiguous segments is Welch's
 *   K_eff = K / (1 + 2 sum_{d=1}^{K-1} (1 - d/K) rho(d)^2)
 * (Welch 1967, IEEE Trans. Audio Electroacoust. 15, 70, eq. 7); for Hann at
 * 50 % overlap rho(1) = 1/6 and K_eff = K / (1 + 2 (1 - 1/K) / 36).
 */

/** Welch statistics of one spectrum, as `spectrum` reports them and an observed series may carry them. */
export interface WelchStatistics {
  /** Segments actually averaged (after transient rejection). */
  segments: number;
  /** Taper of every segment; only the Hann window is known. */
  window: 'hann';
  /** Share of a segment that overlaps the next one, 0 <= overlap < 1. */
  overlap: number;
  /** Equivalent number of independent averages behind each bin (<= segments). */
  effectiveAverages: number;
}

/**
 * Overlap correlation of a (continuous) Hann window w(x) = sin^2(pi x), 0 <= x <= 1, with itself shifted by
 * `shift` segment lengths: int w(x) w(x + s) dx / int w^2 = ((1 - s)(2 + cos 2 pi s) + 3 sin(2 pi s) / (2 pi)) / 3
 * for 0 <= s <= 1, 0 beyond (by direct integration; 1/6 at s = 1/2, as Harris 1978, Proc. IEEE 66, 51, Table 1, gives).
 */
export function hannOverlapCorrelation(shift: number): number {
  const s = Math.abs(shift);
  if (s >= 1) return 0;
  if (s === 0.5) return 1 / 6; // exact; the closed form leaves a rounding residue from sin(pi)
  return ((1 - s) * (2 + Math.cos(2 * Math.PI * s)) + (3 * Math.sin(2 * Math.PI * s)) / (2 * Math.PI)) / 3;
}

function checkOverlap(overlap: number): void {
  if (!(overlap >= 0 && overlap < 1)) throw new RangeError(`overlap must lie in [0, 1), got ${overlap}`);
}

/**
 * K_eff of Hann-windowed segments averaged at the given indexes (segment numbers in the layout, increasing;
 * a plain count means that many contiguous segments) with the given overlap.
 */
export function hannEffectiveAverages(averaged: number | ArrayLike<number>, overlap: number): number {
  checkOverlap(overlap);
  const step = 1 - overlap;
  if (typeof averaged === 'number') {
    const k = averaged;
    if (!Number.isInteger(k) || k < 1) throw new RangeError(`segments must be a whole number of at least 1, got ${k}`);
    let sum = 0;
    for (let d = 1; d < k && d * step < 1; d++) sum += (1 - d / k) * hannOverlapCorrelation(d * step) ** 2;
    return k / (1 + 2 * sum);
  }
  const k = averaged.length;
  if (k < 1) throw new RangeError('no segments averaged');
  let sum = k;
  for (let a = 0; a < k; a++) {
    for (let b = a + 1; b < k && (averaged[b] - averaged[a]) * step < 1; b++) {
      sum += 2 * hannOverlapCorrelation((averaged[b] - averaged[a]) * step) ** 2;
    }
  }
  return (k * k) / sum;
}

/** The statistics of a Hann-windowed Welch spectrum averaged over the given segments (indexes or a contiguous count). */
export function hannWelchStatistics(averaged: number | ArrayLike<number>, overlap: number): WelchStatistics {
  const segments = typeof averaged === 'number' ? averaged : averaged.length;
  return { segments, window: 'hann', overlap, effectiveAverages: hannEffectiveAverages(averaged, overlap) };
}

/** Fewest segments from which the statistics of a Welch spectrum are trusted (below, K_eff itself is too rough). */
export const WELCH_MIN_SEGMENTS = 4;

/**
 * What is wrong with a statistics object, as `field: problem` (null when nothing is): a window other than Hann,
 * an overlap outside [0, 1), fewer than WELCH_MIN_SEGMENTS segments, or an effectiveAverages that is not positive
 * or exceeds the segments.
 */
export function welchStatisticsProblem(w: WelchStatistics): string | null {
  if (w.window !== 'hann') return `window: only "hann" is known, got ${JSON.stringify(w.window)}`;
  if (!(w.overlap >= 0 && w.overlap < 1)) return `overlap: must lie in [0, 1), got ${w.overlap}`;
  if (!Number.isInteger(w.segments) || w.segments < WELCH_MIN_SEGMENTS)
    return `segments: at least ${WELCH_MIN_SEGMENTS} averaged segments are needed to estimate the scatter, got ${w.segments}`;
  if (!(w.effectiveAverages > 0) || !Number.isFinite(w.effectiveAverages))
    return `effectiveAverages: must be a positive number, got ${w.effectiveAverages}`;
  if (w.effectiveAverages > w.segments * (1 + 1e-9))
    return `effectiveAverages: ${w.effectiveAverages} exceeds the ${w.segments} segments averaged`;
  return null;
}
