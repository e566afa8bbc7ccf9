/**
 * Misfit surfaces of a mode-parameter run on the demo day's stored mode fits:
 * the surface is computed on the same problem the run solved (the same
 * recipe as the run solver: fitted modes on the mode grid), so its middle
 * point reproduces the stored minimum's misfit, and every point is finite.
 * The stored result also carries each start's own end, and the minimum's
 * misfit is the smallest of them.
 *
 * Measured, not asserted (2026-12-02): on this interval the mode misfit is
 * smooth within about 0.15 deg of the minimum (chi-square 465.6) but jumps
 * by about -22 (to 444) 0.2 deg out in latitude or longitude, about 0.6
 * standard errors, where the Lorentzian fit of the predicted spectrum changes
 * solution; grid points there lie below the minimum the starts converged to. The engine's mode surface test
 * (test/engine/inverse/surface.test.ts) checks the lowest-point property on
 * synthetic data where the misfit is smooth.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { closeDatabase } from '@/test/helpers/db';
import { getSurfaceById, listRunIntervals } from '@/db/repo/runs';
import { executeRun } from '@/src/runs/execute';
import { makeEngineSolver } from '@/src/runs/solver';
import { computeSurface } from '@/src/runs/surface-compute';
import type { InversionResult, MisfitSurface } from '@/src/engine/inverse/types';
import { demoModeRun, seedDemoDay } from './demo-mode-run';
import { requestSurfaceRow } from './surface-helper';

describe('misfit surfaces of a mode run', () => {
  beforeAll(seedDemoDay);
  afterAll(closeDatabase);

  it('pass through the stored minimum of the interval', async () => {
    const { run } = await demoModeRun('Modes for a surface', '2026-03-14T15:00:00.000Z', '2026-03-14T15:10:00.000Z', 4);
    expect(await executeRun(run.id, { solve: makeEngineSolver(1), workerId: 'mode-surface' })).toBe('finished');
    const [row] = await listRunIntervals(run.id);
    const res = row.result as unknown as InversionResult;
    const best = res.minima[0];
    const own = best.startIndexes.map((s) => res.startEnds!.misfit[s]).filter((v): v is number => v !== null);
    expect(best.misfit).toBe(Math.min(...own));

    const id = await requestSurfaceRow(run.id, {
      interval: row.startsAt.toISOString(),
      minimum: 0,
      x: 'Middle belt.lat',
      y: 'Middle belt.lon',
      points: 5,
      mode: 'fixed',
    });
    expect(await computeSurface(id), (await getSurfaceById(id))?.error ?? '').toBe('ready');
    const surf = (await getSurfaceById(id))!.result as unknown as MisfitSurface & {
      centre: { x: number; y: number; misfit: number };
    };
    for (const v of surf.misfit.flat()) expect(Number.isFinite(v)).toBe(true);
    expect(surf.centre.misfit).toBe(best.misfit);
    // the grid spans +-3 standard errors around the minimum; with an odd number of points and
    // no clipping by the bounds, its middle point is the minimum itself
    expect(surf.x[2]).toBeCloseTo(surf.centre.x, 9);
    expect(surf.y[2]).toBeCloseTo(surf.centre.y, 9);
    expect(Math.abs(surf.misfit[2][2] - best.misfit) / best.misfit).toBeLessThan(1e-6);
  });
});
