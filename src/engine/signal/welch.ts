/**
 * Welch power spectral density (Welch 1967, IEEE Trans. Audio Electroacoust.
 * 15, 70): periodic-Hann-windowed segments, mean removed per segment, squared
 * DFT magnitudes averaged, one-sided and density-scaled,
 *   P_k = c_k |X_k|^2 / (fs sum w^2),  c_k = 2 except at 0 Hz and Nyquist,
 * so that sum_k P_k df equals the (windowed) variance. With the default
 * 50 % overlap this is the estimate scipy.signal.welch gives with its defaults.
 * `welchStatisticsOf` states what the estimate knows of its own scatter
 * (stats/welch-statistics.ts).
 */
import { hannWelchStatistics, type WelchStatistics } from '@/src/engine/stats/welch-statistics';
import { hannWindow, windowPower } from './hann';
import { realPowerPlan } from './real-power';
import { segmentLayout, type SegmentLayout } from './segments';

export interface WelchOptions {
  sampleRateHz: number;
  /** Samples per segment. */
  segmentLength: number;
  /** Samples shared by neighbouring segments; default half a segment (rounded down). */
  overlapLength?: number;
  /** Per-segment selection (1 = average it); segments holding non-finite samples are always left out. */
  keep?: Uint8Array;
}

export interface WelchEstimate {
  frequencies: Float64Array;
  /** One-sided PSD in input-unit^2/Hz; NaN everywhere when no segment could be used. */
  power: Float64Array;
  layout: SegmentLayout;
  /** Segments actually averaged. */
  used: number;
  /** Their indexes in the layout, increasing. */
  usedSegments: Int32Array;
}

export function welch(samples: ArrayLike<number>, options: WelchOptions): WelchEstimate {
  const fs = options.sampleRateHz;
  if (!(fs > 0) || !Number.isFinite(fs)) throw new RangeError(`sample rate must be a positive number, got ${fs}`);
  const layout = segmentLayout(samples.length, options.segmentLength, options.overlapLength);
  if (options.keep && options.keep.length !== layout.count) {
    throw new RangeError(`segment selection has ${options.keep.length} entries for ${layout.count} segments`);
  }
  const n = layout.length;
  const window = hannWindow(n);
  const plan = realPowerPlan(n);
  const bins = plan.bins;
  const frequencies = new Float64Array(bins);
  for (let k = 0; k < bins; k++) frequencies[k] = (k * fs) / n;
  const acc = new Float64Array(bins);
  const seg = new Float64Array(n);
  const pow = new Float64Array(bins);
  let used = 0;
  const usedSegments: number[] = [];
  for (let s = 0; s < layout.count; s++) {
    if (options.keep && !options.keep[s]) continue;
    const start = s * layout.step;
    let sum = 0;
    let finite = true;
    for (let j = 0; j < n; j++) {
      const v = samples[start + j];
      if (!Number.isFinite(v)) {
        finite = false;
        break;
      }
      sum += v;
    }
    if (!finite) continue;
    const mean = sum / n;
    for (let j = 0; j < n; j++) seg[j] = (samples[start + j] - mean) * window[j];
    plan.power(seg, pow);
    for (let k = 0; k < bins; k++) acc[k] += pow[k];
    used++;
    usedSegments.push(s);
  }
  const power = new Float64Array(bins);
  if (used === 0) power.fill(NaN);
  else {
    const scale = 1 / (fs * windowPower(window) * used);
    const nyquist = n % 2 === 0 ? bins - 1 : -1;
    for (let k = 0; k < bins; k++) power[k] = acc[k] * scale * (k === 0 || k === nyquist ? 1 : 2);
  }
  return { frequencies, power, layout, used, usedSegments: Int32Array.from(usedSegments) };
}

/** The Welch statistics of an estimate: the segments averaged, the Hann window, the overlap share and K_eff. */
export function welchStatisticsOf(est: WelchEstimate): WelchStatistics {
  return hannWelchStatistics(est.usedSegments, (est.layout.length - est.layout.step) / est.layout.length);
}
