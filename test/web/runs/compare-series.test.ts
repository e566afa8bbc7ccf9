/**
 * The overlaid daily curves of two runs: one colour per region across both
 * runs (the region's own), a ±1σ band around each estimate, A solid and B
 * dashed. The band is the estimate plus and minus its standard error.
 */
import { describe, expect, it } from 'vitest';
import * as Plot from '@observablehq/plot';
import { compareSeriesFigure } from '@/src/web/runs/figures/compare-series';
import type { IntervalView } from '@/src/runs/results';

const iv = (t: string, I: number, e: number): IntervalView =>
  ({
    startsAt: t,
    nData: 10,
    seconds: 1,
    result: {
      minima: [
        { sources: [{ name: 'Middle belt', lat: 0, lon: 0, intensity: I }], stdErrors: { 'Middle belt': { intensity: e } } },
      ],
    },
  }) as unknown as IntervalView;

describe('compareSeriesFigure', () => {
  const spec = compareSeriesFigure(
    [iv('2031-05-12T06:00:00Z', 3e4, 2e3)],
    [iv('2031-05-12T06:00:00Z', 4e4, 5e3), iv('2031-05-12T06:10:00Z', 5e4, 1e3)],
    { 'Middle belt': '#425fe1' },
  );
  const options = spec.build(Plot as never) as unknown as {
    color: { domain: string[]; range: string[] };
    marks: { data?: unknown[]; ariaLabel?: string; strokeDasharray?: string }[];
  };
  it('one colour per region for both runs', () => {
    expect(options.color.domain).toEqual(['Middle belt']);
    expect(options.color.range).toEqual(['#425fe1']);
  });
  it('bands at ±1σ, A solid and B dashed', () => {
    const band = options.marks[0].data as { key: string; lo: number; hi: number }[];
    expect(band.map((p) => [p.key, p.lo, p.hi])).toEqual([
      ['A · Middle belt', 28000, 32000],
      ['B · Middle belt', 35000, 45000],
      ['B · Middle belt', 49000, 51000],
    ]);
    expect(options.marks[1].strokeDasharray).toBeUndefined();
    expect(options.marks[2].strokeDasharray).toBe('5,3');
  });
});
