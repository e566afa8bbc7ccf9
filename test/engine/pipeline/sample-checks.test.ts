import { describe, expect, it } from 'vitest';
import { clippedShare, hasGaps } from '@/src/engine/pipeline/sample-checks';
import { gaussian, mulberry32 } from '@/src/engine/random';
import { CLIPPING_SHARE_LIMIT } from '@/src/engine/tolerances';

describe('sample checks', () => {
  const rand = mulberry32(99);
  const noise = Float64Array.from({ length: 120_000 }, () => gaussian(rand));

  it('finds no clipping in live noise, even when coarsely quantised', () => {
    expect(clippedShare(noise, null)).toBe(0);
    // rounded to whole counts with sigma 3 counts: the extremes (~ +-14) are hit a handful of times, rarely twice in a row
    const counts = noise.map((v) => Math.round(3 * v));
    expect(clippedShare(counts, null)).toBeLessThan(1e-4);
  });

  it('finds a signal held at its rails', () => {
    // a 7.8 Hz sine of amplitude 2 at 200 Hz, clipped at +-1.5: it sits beyond 1.5 for the share
    // 1 - (2/pi) asin(0.75) = 0.4601 of the time (arcsine law of a sinusoid's values)
    const sine = Float64Array.from({ length: 120_000 }, (_, j) => 2 * Math.sin((2 * Math.PI * 7.8 * j) / 200));
    const clipped = sine.map((v) => Math.max(-1.5, Math.min(1.5, v)));
    expect(Math.abs(clippedShare(clipped, null) - 0.4601)).toBeLessThan(0.01);
    expect(Math.abs(clippedShare(sine, 1.5) - 0.4601)).toBeLessThan(0.01);
    // clipped white noise rarely stays on a rail twice in a row, yet is still far above the flag limit
    const noisy = noise.map((v) => Math.max(-1.5, Math.min(1.5, v)));
    expect(clippedShare(noisy, null)).toBeGreaterThan(CLIPPING_SHARE_LIMIT);
    // P(|x| > 1.5) for a standard normal is 0.1336 (normal tables, Abramowitz & Stegun 26.2)
    expect(Math.abs(clippedShare(noise, 1.5) - 0.1336)).toBeLessThan(0.005);
  });

  it('spots missing samples', () => {
    expect(hasGaps(noise)).toBe(false);
    const g = Float64Array.from(noise);
    g[77] = NaN;
    expect(hasGaps(g)).toBe(true);
  });
});
