/**
 * Interval series: a drifting source is tracked interval by interval (each
 * best minimum within 3 standard errors of that interval's truth); resuming
 * at an index with the previous interval's result reproduces the
 * uninterrupted run exactly; cancellation stops between intervals without
 * reporting a partial one.
 */
import { describe, expect, it } from 'vitest';
import { invertSeries } from '@/src/engine/inverse/interval-series';
import type { SpectrumInversionInput } from '@/src/engine/inverse/interval-problem';
import { LINEAR_CAVITY, syntheticObserved } from './helpers';

const stations = [
  { code: 'IA1', lat: 48, lon: 10 },
  { code: 'IA2', lat: -20, lon: 60 },
  { code: 'IA3', lat: 15, lon: -40 },
  { code: 'IA4', lat: -40, lon: -10 },
];
const freqs = Float64Array.from({ length: 25 }, (_, i) => 6 + i);
const truth = (i: number) => ({ lat: 2 + 1.5 * i, lon: 20 - 2 * i, intensity: 2e4 * (1 + 0.3 * i) });
const intervals: SpectrumInversionInput[] = [0, 1, 2, 3].map((i) => ({
  cavity: LINEAR_CAVITY,
  stations,
  observed: syntheticObserved(stations, [truth(i)], freqs, 0.1, 500 + i),
  unknowns: [{ name: 'R1', intensity: { min: 100, max: 1e6 }, lat: { min: -30, max: 30 }, lon: { min: -10, max: 50 } }],
}));

describe('interval series', () => {
  it('tracks a drifting source and resumes to identical results', async () => {
    const seen: number[] = [];
    const full = await invertSeries(
      intervals,
      { starts: 16, seed: 4, threads: 1 },
      { onInterval: (r) => void seen.push(r.index) },
    );
    expect(full.cancelled).toBe(false);
    expect(seen).toEqual([0, 1, 2, 3]);
    full.results.forEach(({ index, result }) => {
      const best = result.minima[0];
      const t = truth(index);
      const e = best.stdErrors.R1;
      expect(Math.abs(best.sources[0].lat - t.lat)).toBeLessThan(3 * e.lat!);
      expect(Math.abs(best.sources[0].lon - t.lon)).toBeLessThan(3 * e.lon!);
      expect(Math.abs(best.sources[0].intensity - t.intensity)).toBeLessThan(3 * e.intensity!);
      expect(result.minima.reduce((s, m) => s + m.count, 0)).toBe(16);
    });
    const resumed = await invertSeries(intervals, {
      starts: 16,
      seed: 4,
      threads: 1,
      fromIndex: 2,
      previous: full.results[1].result,
    });
    expect(resumed.results.map((r) => r.index)).toEqual([2, 3]);
    for (const r of resumed.results) {
      const ref = full.results[r.index].result;
      expect(r.result.minima.map((m) => m.internal)).toEqual(ref.minima.map((m) => m.internal));
      expect(r.result.minima.map((m) => m.count)).toEqual(ref.minima.map((m) => m.count));
    }
  });

  it('stops between intervals when cancelled and reports only finished ones', async () => {
    let finished = 0;
    const out = await invertSeries(
      intervals,
      { starts: 4, seed: 1, threads: 1 },
      {
        onInterval: () => void finished++,
        shouldCancel: () => finished >= 1,
      },
    );
    expect(out.cancelled).toBe(true);
    expect(out.results.map((r) => r.index)).toEqual([0]);
  });
});
