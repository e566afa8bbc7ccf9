/**
 * Suppression of narrow interference lines in a power spectrum: the mains
 * line and its harmonics and any listed fixed lines (a 16.7 Hz railway supply,
 * for example) are cut out and the notch is bridged by a straight line in
 * ln(power) between the mean log power of a few bins on each side (common
 * practice). Bins that were bridged are marked so that fits may ignore them.
 */
import { INTERFERENCE_LINE_HALF_WIDTH_HZ, LINE_ANCHOR_BINS, MAINS_LINE_HALF_WIDTH_HZ } from '@/src/engine/tolerances';

export interface SpectralLine {
  frequencyHz: number;
  /** Half-width of the notch in Hz. */
  halfWidthHz: number;
}

/** The mains line and its harmonics below maxHz. */
export function mainsLines(mainsHz: number, maxHz: number, halfWidthHz = MAINS_LINE_HALF_WIDTH_HZ): SpectralLine[] {
  if (!(mainsHz > 0)) throw new RangeError(`mains frequency must be positive, got ${mainsHz}`);
  const out: SpectralLine[] = [];
  for (let k = 1; k * mainsHz - halfWidthHz <= maxHz; k++) out.push({ frequencyHz: k * mainsHz, halfWidthHz });
  return out;
}

/** Listed lines (e.g. a station's interference lines) with the default notch width unless given. */
export function listedLines(lines: readonly { frequencyHz: number; halfWidthHz?: number }[]): SpectralLine[] {
  return lines.map((l, i) => {
    if (!(l.frequencyHz > 0))
      throw new RangeError(`interference line ${i + 1}: frequency must be positive, got ${l.frequencyHz}`);
    return { frequencyHz: l.frequencyHz, halfWidthHz: l.halfWidthHz ?? INTERFERENCE_LINE_HALF_WIDTH_HZ };
  });
}

export interface SuppressedSpectrum {
  power: Float64Array;
  /** 1 where the bin was replaced by the bridge. */
  suppressed: Uint8Array;
}

function anchor(power: ArrayLike<number>, from: number, to: number): number {
  let s = 0;
  let n = 0;
  for (let k = Math.max(0, from); k <= Math.min(power.length - 1, to); k++) {
    if (power[k] > 0) {
      s += Math.log(power[k]);
      n++;
    }
  }
  return n ? s / n : NaN;
}

export function suppressLines(
  frequencies: ArrayLike<number>,
  power: ArrayLike<number>,
  lines: readonly SpectralLine[],
): SuppressedSpectrum {
  const n = power.length;
  if (frequencies.length !== n) throw new RangeError(`frequencies (${frequencies.length}) and power (${n}) differ in length`);
  const suppressed = new Uint8Array(n);
  for (const line of lines) {
    for (let k = 0; k < n; k++) if (Math.abs(frequencies[k] - line.frequencyHz) <= line.halfWidthHz) suppressed[k] = 1;
  }
  const out = Float64Array.from(power);
  let k = 0;
  while (k < n) {
    if (!suppressed[k]) {
      k++;
      continue;
    }
    const lo = k;
    while (k < n && suppressed[k]) k++;
    const hi = k - 1; // notch covers lo..hi
    const left = anchor(power, lo - LINE_ANCHOR_BINS, lo - 1);
    const right = anchor(power, hi + 1, hi + LINE_ANCHOR_BINS);
    const fl = frequencies[Math.max(0, lo - Math.round((LINE_ANCHOR_BINS + 1) / 2))];
    const fr = frequencies[Math.min(n - 1, hi + Math.round((LINE_ANCHOR_BINS + 1) / 2))];
    for (let j = lo; j <= hi; j++) {
      let lp: number;
      if (Number.isFinite(left) && Number.isFinite(right)) lp = left + ((right - left) * (frequencies[j] - fl)) / (fr - fl);
      else lp = Number.isFinite(left) ? left : right;
      out[j] = Number.isFinite(lp) ? Math.exp(lp) : power[j];
    }
  }
  return { power: out, suppressed };
}
