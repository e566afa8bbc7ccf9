/**
 * Mode runs on the demo day's stored mode fits, with the demo grid's moving
 * regions (the middle belt's centre free): every interval must end on finite
 * misfits with a regular covariance. Before the mode misfit handled predicted
 * spectra without a peak near an observed mode, every start of these
 * intervals stopped on a non-finite misfit and the run still said "finished".
 * Also: the driver refuses to call an interval solved when its best minimum
 * has no finite misfit, and fails the run saying why.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { closeDatabase } from '@/test/helpers/db';
import { getRunById, listRunIntervals } from '@/db/repo/runs';
import { executeRun } from '@/src/runs/execute';
import { makeEngineSolver } from '@/src/runs/solver';
import type { InversionResult } from '@/src/engine/inverse/types';
import { demoModeRun, seedDemoDay } from './demo-mode-run';
import type { IntervalSolver } from '@/src/runs/types';

async function modeRun(name: string, from: string, to: string) {
  const made = await demoModeRun(name, from, to, 6);
  expect(made.config.regions.some((r) => r.lat && r.lon)).toBe(true);
  return made;
}

describe('mode runs on the demo data', () => {
  beforeAll(seedDemoDay);
  afterAll(closeDatabase);

  it('ends every interval on finite misfits with the moving regions free', async () => {
    const { run, config, preview } = await modeRun('Modes, moving belts', '2026-03-14T14:50:00.000Z', '2026-03-14T15:10:00.000Z');
    const outcome = await executeRun(run.id, { solve: makeEngineSolver(1), workerId: 'modes' });
    expect(outcome, (await getRunById(run.id))?.error ?? '').toBe('finished');
    const rows = await listRunIntervals(run.id);
    expect(rows.map((r) => r.startsAt.toISOString())).toEqual(preview.intervalStarts);
    for (const row of rows) {
      const res = row.result as unknown as InversionResult;
      expect(res.paramNames).toContain('Middle belt.lat');
      // Multi-start bookkeeping: counts of starts per minimum add up to the number of starts.
      expect(res.minima.reduce((n, m) => n + m.count, 0)).toBe(config.starts);
      for (const m of res.minima) {
        expect(typeof m.misfit === 'number' && Number.isFinite(m.misfit)).toBe(true);
        expect(m.stopReasons['non-finite'] ?? 0).toBe(0);
      }
      const best = res.minima[0];
      expect(best.singular).toBe(false);
      for (const v of Object.values(best.stdErrors['Middle belt'])) expect(Number.isFinite(v as number)).toBe(true);
      // Goodness per station/component: three data per observed mode, the shares adding up to the best chi2.
      const series = (res as unknown as { seriesMisfits: { chi2: number; n: number }[] }).seriesMisfits;
      expect(series.reduce((a, s) => a + s.n, 0)).toBe(res.nData);
      expect(series.reduce((a, s) => a + s.chi2, 0)).toBeCloseTo(best.misfit, 6);
    }
    // Each misfit evaluation fits every predicted spectrum with the pipeline's mode fit (predicted-modes.ts): minutes, not seconds, on a busy 2-core machine.
  }, 300_000);

  it('fails the run, saying why, when the best minimum of an interval has no finite misfit', async () => {
    const { run } = await modeRun('Modes, nothing finite', '2026-03-14T15:00:00.000Z', '2026-03-14T15:10:00.000Z');
    // A solver whose every start ended on a non-finite misfit (what the engine returned before the fix).
    const nothingFinite: IntervalSolver = async () => ({
      nData: 9,
      result: { minima: [{ misfit: NaN, count: 6, stopReasons: { 'non-finite': 6 } }] },
    });
    expect(await executeRun(run.id, { solve: nothingFinite, workerId: 'modes' })).toBe('failed');
    const after = await getRunById(run.id);
    expect(after!.state).toBe('failed');
    expect(after!.error).toMatch(/Interval 2026-03-14 15:00 UT failed: no start reached a finite misfit/);
    expect(after!.error).toMatch(/non-finite 6/);
    expect(await listRunIntervals(run.id)).toHaveLength(0);
  });
});
