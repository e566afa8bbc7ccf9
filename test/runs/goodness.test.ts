/**
 * Goodness of fit of a run: sums, degree-of-freedom shares, the implausible mark, and error scaling.
 * The p-values themselves are checked against scipy in test/engine/stats/chi-square.test.ts.
 */
import { describe, expect, it } from 'vitest';
import {
  IMPLAUSIBLE_FIT_P,
  goodnessOf,
  intervalSeriesGoodness,
  misfitErrorScale,
  runGoodness,
  seriesShares,
  type GoodnessSource,
} from '@/src/runs/goodness';
import { gaussian, mulberry32 } from '@/src/engine/random';

const iv = (startsAt: string, misfit: number, nData: number, nParams: number, series?: [string, number, number][]) =>
  ({
    startsAt,
    nData,
    result: {
      nParams,
      minima: [{ misfit }],
      ...(series ? { seriesMisfits: series.map(([station, chi2, n]) => ({ station, component: 'Ez' as const, chi2, n })) } : {}),
    },
  }) satisfies GoodnessSource;

describe('run goodness of fit', () => {
  it('gives each series its share of the parameters, so the shares add up to the interval dof', () => {
    const shares = seriesShares(
      [
        { station: 'A', component: 'Ez', chi2: 10, n: 30 },
        { station: 'B', component: 'Ez', chi2: 20, n: 10 },
      ],
      4,
    );
    expect(shares.map((s) => s.dof)).toEqual([27, 9]);
    expect(shares.reduce((a, s) => a + s.dof, 0)).toBe(40 - 4);
  });

  it('sums chi2 and dof over intervals and per station/component, and marks what is implausible', () => {
    const g = runGoodness([
      iv('2031-01-01T00:00:00.000Z', 40, 42, 2, [
        ['A', 15, 21],
        ['B', 25, 21],
      ]),
      // far too large a misfit for 40 dof
      iv('2031-01-01T00:10:00.000Z', 400, 42, 2, [
        ['A', 380, 21],
        ['B', 20, 21],
      ]),
      // solved before per-series misfits were kept
      iv('2031-01-01T00:20:00.000Z', 38, 42, 2),
      { startsAt: '2031-01-01T00:30:00.000Z', nData: 0, result: null },
    ]);
    expect(g.threshold).toBe(IMPLAUSIBLE_FIT_P);
    expect(g.intervals.map((i) => i.implausible)).toEqual([false, true, false]);
    expect(g.run!.chi2).toBe(478);
    expect(g.run!.dof).toBe(120);
    expect(g.run!.implausible).toBe(true);
    expect(g.seriesMissing).toBe(1);
    const a = g.series.find((s) => s.station === 'A')!;
    expect(a).toMatchObject({ chi2: 395, dof: 40, intervals: 2, implausible: true });
    const b = g.series.find((s) => s.station === 'B')!;
    expect(b).toMatchObject({ chi2: 45, dof: 40, implausible: false });
    expect(intervalSeriesGoodness(iv('x', 1, 5, 1))).toEqual([]);
  });

  it('marks implausible exactly below the threshold', () => {
    // chi2 with P = 1e-3 at 20 dof: scipy.stats.chi2.isf(1e-3, 20) = 45.31475... (fixtures/chi2/chi2_sf.json)
    expect(goodnessOf(45.2, 20).implausible).toBe(false);
    expect(goodnessOf(45.4, 20).implausible).toBe(true);
  });

  it('gives uniform p-values for a least-squares fit whose errors are right (known truth, 2000 realisations)', () => {
    // Straight line y = a + b x fitted to 12 points with Gaussian noise of the stated sigma: chi2 ~ chi-square(10)
    // (common practice), so P(>= chi2) is uniform on [0, 1] and about 1 in 1000 fits is marked implausible.
    const rnd = mulberry32(7);
    const xs = Array.from({ length: 12 }, (_, i) => i);
    const sigma = 0.3;
    const ps: number[] = [];
    for (let k = 0; k < 2000; k++) {
      const ys = xs.map((x) => 1 + 0.5 * x + sigma * gaussian(rnd));
      const n = xs.length;
      const sx = xs.reduce((a, x) => a + x, 0);
      const sy = ys.reduce((a, y) => a + y, 0);
      const sxx = xs.reduce((a, x) => a + x * x, 0);
      const sxy = xs.reduce((a, x, i) => a + x * ys[i], 0);
      const b = (n * sxy - sx * sy) / (n * sxx - sx * sx);
      const a = (sy - b * sx) / n;
      const chi2 = xs.reduce((acc, x, i) => acc + ((ys[i] - a - b * x) / sigma) ** 2, 0);
      ps.push(goodnessOf(chi2, n - 2).p);
    }
    ps.sort((u, v) => u - v);
    // Kolmogorov-Smirnov distance to the uniform law; 1.63 / sqrt(n) is its 1 % critical value (common practice).
    const d = Math.max(...ps.map((p, i) => Math.max((i + 1) / ps.length - p, p - i / ps.length)));
    expect(d).toBeLessThan(1.63 / Math.sqrt(ps.length));
  });

  it('scales errors only up, and only when asked', () => {
    expect(misfitErrorScale(4, true)).toBe(2);
    expect(misfitErrorScale(0.25, true)).toBe(1);
    expect(misfitErrorScale(4, false)).toBe(1);
    expect(misfitErrorScale(Number.NaN, true)).toBe(1);
  });
});
