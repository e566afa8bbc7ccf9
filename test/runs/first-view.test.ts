import { describe, expect, it } from 'vitest';
import { BRIEF_DIGITS, firstView, type RunView } from '@/src/runs/results';
import type { InversionResult } from '@/src/engine/inverse/types';

// A run view built by hand: three intervals with one or two minima each, the last one unsolved.
function minimum(seed: number) {
  return {
    misfit: 10 + seed,
    reducedChi2: 1.1,
    count: 3,
    startIndexes: [0, 1, 2],
    internal: [Math.log(2e4 + seed)],
    params: {},
    sources: [
      {
        name: 'North belt',
        lat: -1.98917276305476 + seed,
        lon: 23.97088716107521,
        intensity: 29770.942455289398 * (1 + seed / 7),
      },
      {
        name: 'South belt',
        lat: -5.019001817489643,
        lon: -50,
        spread: 7.9650086686350585,
        intensity: 0.000123456789 * (1 + seed),
      },
    ],
    stdErrors: { 'North belt': { intensity: 379.1669798496104, lat: 0.3, lon: 0.4 }, 'South belt': { intensity: 3.3e-6 } },
    correlation: { names: ['a'], matrix: [[1]] },
    resolution: { names: ['a'], matrix: [[1]] },
    singular: false,
    rank: 1,
    stopReasons: {},
  };
}
const result = (k: number) =>
  ({
    minima: [minimum(k), minimum(k + 0.5)],
    starts: 4,
    unconverged: 0,
    paramNames: ['North belt.intensity'],
  }) as unknown as InversionResult;
const view = {
  run: { id: 'r', intervalStarts: [] },
  config: {},
  model: {},
  grid: {},
  intervals: [
    { startsAt: '2031-07-02T00:00:00.000Z', nData: 40, seconds: 1, result: result(1) },
    { startsAt: '2031-07-02T00:10:00.000Z', nData: 40, seconds: 1, result: result(2) },
    { startsAt: '2031-07-02T00:20:00.000Z', nData: 40, seconds: 1, result: result(3) },
    { startsAt: '2031-07-02T00:30:00.000Z', nData: 0, seconds: 0, result: null, skipped: 'no data' },
  ],
} as unknown as RunView;

describe('firstView', () => {
  const first = firstView(view);

  it('keeps the interval the page opens on (the last solved one) and unsolved intervals whole', () => {
    expect(first.intervals[2]).toEqual(view.intervals[2]);
    expect(first.intervals[3]).toEqual(view.intervals[3]);
  });

  it('keeps of every other interval only what the daily curves draw: best-minimum intensities and their errors', () => {
    for (const k of [0, 1]) {
      const iv = first.intervals[k];
      expect(iv.brief).toBe(true);
      expect(iv.result!.minima).toHaveLength(1);
      const m = iv.result!.minima[0];
      expect(m.sources.map((s) => Object.keys(s).sort())).toEqual([
        ['intensity', 'name'],
        ['intensity', 'name'],
      ]);
      expect(Object.keys(m.stdErrors['North belt'])).toEqual(['intensity']);
      // Rounding to n significant digits moves a value by at most half a unit in its last kept
      // digit: |x - round(x)| <= 0.5 * 10^(1 - n) * |x| (relative), here n = BRIEF_DIGITS.
      const full = view.intervals[k].result!.minima[0];
      full.sources.forEach((s, i) => {
        expect(Math.abs(m.sources[i].intensity - s.intensity)).toBeLessThanOrEqual(0.5 * 10 ** (1 - BRIEF_DIGITS) * s.intensity);
        const e = full.stdErrors[s.name].intensity!;
        expect(Math.abs(m.stdErrors[s.name].intensity! - e)).toBeLessThanOrEqual(0.5 * 10 ** (1 - BRIEF_DIGITS) * e);
      });
    }
  });

  it('sends less than half the bytes for a brief interval', () => {
    expect(JSON.stringify(first.intervals[0]).length).toBeLessThan(JSON.stringify(view.intervals[0]).length / 2);
  });
});
