/**
 * The run view's goodness of fit and shown errors, read back from stored runs: per interval, per
 * station/component and for the run; implausible intervals marked; errors scaled by the misfit only
 * when the run was launched with that switch, and labelled; old runs' scaled errors divided back.
 * Results are stored by the run driver with a stand-in solver whose misfits are chosen, so the
 * expected marks are known (p-values: test/engine/stats/chi-square.test.ts against scipy).
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { closeDatabase, resetDatabase } from '@/test/helpers/db';
import { executeRun } from '@/src/runs/execute';
import { getIntervalView, getRunSummary, getRunView, minimaRows } from '@/src/runs/results';
import type { RunConfig } from '@/src/runs/config';
import type { IntervalSolver } from '@/src/runs/types';
import type { ShownMinimum } from '@/src/runs/error-scaling';
import { makeRunWorld, newRun } from './world';

const STD_ERROR = 100;

/** A stand-in solver: one minimum with misfit `chi2s[i] * dof`, split evenly over the series. */
function solverWith(reduced: number[], stated: boolean): IntervalSolver {
  let i = 0;
  return async (_ctx, c) => {
    const nData = c.observed.reduce((n, s) => n + s.power.length, 0);
    const nParams = 3;
    const r = reduced[i++];
    const misfit = r * (nData - nParams);
    return {
      nData,
      result: {
        starts: 1,
        nData,
        nParams,
        paramNames: ['East basin.intensity', 'East basin.lat', 'East basin.lon'],
        minima: [
          {
            misfit,
            reducedChi2: r,
            count: 1,
            startIndexes: [0],
            sources: [{ name: 'East basin', lat: 0, lon: 20, intensity: 3e4 }],
            params: {},
            internal: [0, 0, 0],
            stdErrors: { 'East basin': { intensity: STD_ERROR, lat: 1, lon: 2 } },
            correlation: { names: [], matrix: [] },
            resolution: { names: [], matrix: [] },
            singular: false,
            rank: 3,
            stopReasons: {},
          },
        ],
        startEnds: { index: [0], misfit: [misfit], iterations: [3], stopReason: ['gradient'], minimum: [0] },
        ...(stated ? { errorBasis: 'stated' } : {}),
        seriesMisfits: c.observed.map((s) => ({
          station: s.station,
          component: s.component,
          chi2: (misfit * s.power.length) / nData,
          n: s.power.length,
        })),
      },
    };
  };
}

async function storedRun(w: Awaited<ReturnType<typeof makeRunWorld>>, config: RunConfig, solve: IntervalSolver) {
  const run = await newRun(w, config);
  expect(await executeRun(run.id, { solve, workerId: 'goodness' })).toBe('finished');
  return getRunView(w.networkId, run.id);
}

describe('run view: goodness of fit and shown errors', () => {
  let w: Awaited<ReturnType<typeof makeRunWorld>>;
  beforeAll(async () => {
    await resetDatabase();
    w = await makeRunWorld(3);
  });
  afterAll(closeDatabase);

  it('marks the implausible interval and scales its errors when the run asks for it, saying so', async () => {
    const config: RunConfig = { ...w.config, name: 'Scaled', scaleErrorsByMisfit: true };
    // 3 stations x 3 components x 49 bins = 441 data, 438 dof: chi2/dof 1.0 is plausible, 2.25 is not.
    const view = await storedRun(w, config, solverWith([1.0, 2.25, 0.5], true));
    expect(view.errorsScaledByMisfit).toBe(true);
    const g = view.goodness;
    expect(g.intervals.map((i) => i.implausible)).toEqual([false, true, false]);
    expect(g.intervals[0].dof).toBe(438);
    expect(g.run!.dof).toBe(3 * 438);
    expect(g.series).toHaveLength(9);
    expect(g.series.reduce((a, s) => a + s.dof, 0)).toBeCloseTo(3 * 438, 9);
    const minima = view.intervals.map((iv) => iv.result!.minima[0] as ShownMinimum);
    expect(minima.map((m) => m.errorScale)).toEqual([1, 1.5, 1]);
    expect(minima[1].stdErrors['East basin'].intensity).toBeCloseTo(1.5 * STD_ERROR, 9);
    expect(minima[2].stdErrors['East basin'].intensity).toBe(STD_ERROR); // never shrunk
    const rows = minimaRows(view);
    expect(rows.map((r) => r.fit_implausible)).toEqual(['no', 'yes', 'no']);
    expect(rows[1].errors_scaled_by).toBe(1.5);
    expect(rows[1]['East basin.intensity_stderr']).toBeCloseTo(150, 9);
    // What the page gets first (cut down in the database) has the same goodness and the same shown errors.
    const summary = await getRunSummary(w.networkId, view.run.id);
    expect(summary.goodness).toEqual(view.goodness);
    expect(summary.intervals[1].brief).toBe(true);
    const briefBest = summary.intervals[1].result!.minima[0] as ShownMinimum;
    expect(briefBest.errorScale).toBe(1.5);
    expect(briefBest.stdErrors['East basin'].intensity).toBeCloseTo(1.5 * STD_ERROR, 9);
    // And so does one interval fetched whole.
    const one = await getIntervalView(w.networkId, view.run.id, new Date(view.intervals[1].startsAt));
    expect((one.result!.minima[0] as ShownMinimum).errorScale).toBe(1.5);
  });

  it('shows errors as stated when the switch is off, and divides an old run’s scaled errors back', async () => {
    const plain = await storedRun(w, { ...w.config, name: 'Plain' }, solverWith([1.0, 2.25, 0.5], true));
    expect(plain.errorsScaledByMisfit).toBe(false);
    expect(plain.intervals.map((iv) => (iv.result!.minima[0] as ShownMinimum).errorScale)).toEqual([1, 1, 1]);
    expect(plain.goodness.intervals.map((i) => i.implausible)).toEqual([false, true, false]);
    // A run launched with the old covariance switch, solved before errors were stored as stated:
    // its stored errors carry sqrt(chi2/dof), which the view divides out (and then, the switch being on, scales up).
    const old: RunConfig = { ...w.config, name: 'Old', damping: { ...w.config.damping, scaleCovariance: true } };
    delete old.scaleErrorsByMisfit;
    const legacy = await storedRun(w, old, solverWith([1.0, 2.25, 0.25], false));
    const errs = legacy.intervals.map((iv) => (iv.result!.minima[0] as ShownMinimum).stdErrors['East basin'].intensity!);
    expect(errs[0]).toBeCloseTo(STD_ERROR, 9);
    expect(errs[1]).toBeCloseTo(STD_ERROR, 9); // / 1.5 back, x 1.5 by the misfit
    expect(errs[2]).toBeCloseTo(2 * STD_ERROR, 9); // / 0.5 back, not shrunk again
    const brief = (await getRunSummary(w.networkId, legacy.run.id)).intervals[0].result!.minima[0] as ShownMinimum;
    expect(brief.stdErrors['East basin'].intensity).toBeCloseTo(STD_ERROR, 9);
    // The goodness of every interval shows for old runs too.
    expect(legacy.goodness.intervals).toHaveLength(3);
  });
});
