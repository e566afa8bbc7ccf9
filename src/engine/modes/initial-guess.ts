/**
 * Starting values and bounds for a mode fit: each mode starts at the highest
 * point of the lightly smoothed spectrum within a window around its usual
 * frequency, with the height above a flat background at the spectrum's lowest
 * level and the half-width where the smoothed spectrum falls to half that
 * height (clamped to the allowed range).
 */
import { MODE_FREQUENCY_WINDOW_HZ, MODE_HALF_WIDTH_MAX_HZ, MODE_HALF_WIDTH_MIN_HZ } from '@/src/engine/tolerances';
import { paramCount } from './types';

export interface ModeStart {
  start: Float64Array;
  lower: Float64Array;
  upper: Float64Array;
}

function smooth(y: ArrayLike<number>, half: number): Float64Array {
  const out = new Float64Array(y.length);
  for (let i = 0; i < y.length; i++) {
    let s = 0;
    let n = 0;
    for (let j = Math.max(0, i - half); j <= Math.min(y.length - 1, i + half); j++) {
      s += y[j];
      n++;
    }
    out[i] = s / n;
  }
  return out;
}

/** freqs/power: the bins used by the fit (sorted by frequency); guesses: one usual frequency per mode. */
export function initialGuess(freqs: Float64Array, power: Float64Array, guesses: readonly number[]): ModeStart {
  const modes = guesses.length;
  const np = paramCount(modes);
  const start = new Float64Array(np);
  const lower = new Float64Array(np).fill(-Infinity);
  const upper = new Float64Array(np).fill(Infinity);
  const df = freqs.length > 1 ? (freqs[freqs.length - 1] - freqs[0]) / (freqs.length - 1) : 1;
  const y = smooth(power, Math.max(1, Math.round(0.15 / df)));
  let floor = Infinity;
  for (const v of y) floor = Math.min(floor, v);
  const fMin = freqs[0];
  const fMax = freqs[freqs.length - 1];
  guesses.forEach((u, n) => {
    const lo = Math.max(fMin, u - MODE_FREQUENCY_WINDOW_HZ);
    const hi = Math.min(fMax, u + MODE_FREQUENCY_WINDOW_HZ);
    let best = -1;
    for (let i = 0; i < freqs.length; i++) {
      if (freqs[i] < lo || freqs[i] > hi) continue;
      if (best < 0 || y[i] > y[best]) best = i;
    }
    const f0 = best >= 0 ? freqs[best] : Math.min(Math.max(u, fMin), fMax);
    const height = best >= 0 ? Math.max(y[best] - floor, 1e-3 * Math.abs(y[best]) || 1e-30) : 1e-30;
    let g = u / 9; // Q about 4.5 when the half-height point cannot be found
    if (best >= 0) {
      const half = floor + height / 2;
      let r = best;
      while (r < y.length - 1 && y[r] > half) r++;
      let l = best;
      while (l > 0 && y[l] > half) l--;
      const w = 0.5 * (freqs[r] - freqs[l]);
      if (w > 0) g = w;
    }
    g = Math.min(Math.max(g, MODE_HALF_WIDTH_MIN_HZ * 1.5), MODE_HALF_WIDTH_MAX_HZ / 2);
    start.set([f0, height, g], 3 * n);
    lower.set([lo, 0, MODE_HALF_WIDTH_MIN_HZ], 3 * n);
    upper.set([hi, Infinity, MODE_HALF_WIDTH_MAX_HZ], 3 * n);
  });
  start[3 * modes] = Number.isFinite(floor) ? floor : 0;
  start[3 * modes + 1] = 0;
  return { start, lower, upper };
}
