import { describe, expect, it } from 'vitest';
import { screenTransients } from '@/src/engine/signal/transients';
import { segmentLayout, segmentStats } from '@/src/engine/signal/segments';
import { welch } from '@/src/engine/signal/welch';
import { gaussian, mulberry32 } from '@/src/engine/random';

describe('transient screen', () => {
  const fs = 200;
  const n = 2000;

  function record(seed: number): Float64Array {
    const rand = mulberry32(seed);
    return Float64Array.from({ length: fs * 600 }, () => gaussian(rand));
  }

  it('keeps every segment of stationary Gaussian noise', () => {
    // Sample variance of 2000 N(0,1) values has relative sd sqrt(2/2000) ~ 3 % (chi-square, any statistics text),
    // far inside a factor 2.5.
    const x = record(11);
    const layout = segmentLayout(x.length, n);
    const screen = screenTransients(segmentStats(x, layout).variance);
    expect(screen.rejected).toBe(0);
    expect(screen.keep.every((v) => v === 1)).toBe(true);
  });

  it('rejects the segments a burst falls into and restores the background level', () => {
    const x = record(12);
    // a decaying 30-sigma burst at 300.0 s (sample 60000): segments 59 and 60 (step 1000) contain it
    for (let j = 0; j < 400; j++) x[60000 + j] += 30 * Math.exp(-j / 80) * Math.sin(j);
    const layout = segmentLayout(x.length, n);
    const stats = segmentStats(x, layout);
    const screen = screenTransients(stats.variance);
    const rejected = [...screen.keep].flatMap((k, i) => (k ? [] : [i]));
    expect(rejected).toEqual([59, 60]);
    // White noise of unit variance has one-sided density 2/fs = 0.01 per Hz (definition of the density scaling).
    const clean = welch(x, { sampleRateHz: fs, segmentLength: n, keep: screen.keep });
    const dirty = welch(x, { sampleRateHz: fs, segmentLength: n });
    const mean = (p: Float64Array) => p.slice(1, -1).reduce((a, b) => a + b, 0) / (p.length - 2);
    expect(Math.abs(mean(clean.power) - 2 / fs) / (2 / fs)).toBeLessThan(0.02);
    expect(mean(dirty.power)).toBeGreaterThan(1.1 * (2 / fs));
  });

  it('counts segments with missing samples apart from rejected ones', () => {
    const x = record(13);
    x.fill(NaN, 5000, 5100);
    const layout = segmentLayout(x.length, n);
    const screen = screenTransients(segmentStats(x, layout).variance);
    expect(screen.incomplete).toBe(2);
    expect(screen.rejected).toBe(0);
  });

  it('rejects bad options with a clear message', () => {
    expect(() => screenTransients(new Float64Array(3), { minRatio: 0.5 })).toThrow(/minRatio/);
  });
});
