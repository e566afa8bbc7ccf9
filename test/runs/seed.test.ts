/** The demo runs seeder: models, a grid and two finished runs (spectra, fitted modes) on the demo stations' data; running it again changes nothing. */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { closeDatabase, resetDatabase } from '@/test/helpers/db';
import * as accounts from '@/src/ops/seed/accounts';
import * as stations from '@/src/ops/seed/stations';
import * as runs from '@/src/ops/seed/runs';
import { modelRepo } from '@/db/repo/models';
import { gridRepo } from '@/db/repo/grids';
import { listRunIntervals, listRuns } from '@/db/repo/runs';
import type { InversionResult } from '@/src/engine/inverse/types';
import { getRunById } from '@/db/repo/runs';
import { getRunView } from '@/src/runs/results';
import { queueCheckedRun } from '@/test/helpers/runs';
import { executeRun } from '@/src/runs/execute';
import { makeEngineSolver } from '@/src/runs/solver';
import type { RunConfig } from '@/src/runs/config';

describe('demo runs seeder', () => {
  beforeAll(async () => {
    await resetDatabase();
    await accounts.seed();
    await stations.seed();
  });
  afterAll(closeDatabase);

  it('stores a finished run whose best minimum places the middle belt inside its bounds', async () => {
    const t0 = Date.now();
    await runs.seed();
    console.log(`[seed test] runs seeder took ${((Date.now() - t0) / 1000).toFixed(1)} s`);
    const net = await accounts.demoNetworkId();
    const [run] = (await listRuns(net)).filter((r) => r.name === runs.DEMO_RUN);
    expect(run.state).toBe('finished');
    const rows = await listRunIntervals(run.id);
    expect(rows).toHaveLength(13); // 14:00 to 16:00 UT every 10 minutes
    const best = (rows[0].result as unknown as InversionResult).minima[0];
    const middle = best.sources.find((s) => s.name === 'Middle belt')!;
    expect(middle.lat).toBeGreaterThanOrEqual(-15);
    expect(middle.lat).toBeLessThanOrEqual(15);
    // Counts of starts per minimum add up to the number of starts.
    expect((rows[0].result as unknown as InversionResult).minima.reduce((n, m) => n + m.count, 0)).toBe(4);

    await runs.seed();
    expect((await listRuns(net)).filter((r) => r.name === runs.DEMO_RUN)).toHaveLength(1);
    expect(await listRunIntervals(run.id)).toHaveLength(13);
    expect(await modelRepo.list(net)).toHaveLength(2);
    expect(await gridRepo.list(net)).toHaveLength(1);
  }, 600_000); // the seeder solves both demo runs; minutes on a busy machine

  it("stores a finished mode-parameter run that keeps each start's own end", async () => {
    const net = await accounts.demoNetworkId();
    const [run] = (await listRuns(net)).filter((r) => r.name === runs.DEMO_MODE_RUN);
    expect(run.state).toBe('finished');
    const rows = await listRunIntervals(run.id);
    expect(rows).toHaveLength(2); // 15:00 and 15:10 UT
    for (const row of rows) {
      const res = row.result as unknown as InversionResult;
      expect(res.paramNames).toContain('Middle belt.lat');
      expect(res.startEnds!.index).toEqual([0, 1, 2, 3]);
      // each minimum's misfit is the smallest final misfit of the starts counted in it
      for (const m of res.minima)
        expect(m.misfit).toBe(Math.min(...m.startIndexes.map((i) => res.startEnds!.misfit[i] ?? Infinity)));
    }
  });

  it("inverts the stored mode fits of the demo data with the engine's mode objective", async () => {
    const net = await accounts.demoNetworkId();
    const [demo] = (await listRuns(net)).filter((r) => r.name === runs.DEMO_RUN);
    const view = await getRunView(net, demo.id);
    const config: RunConfig = {
      ...view.config,
      name: 'Modes',
      observables: { kind: 'modes', modes: 3 },
      data: { ...view.config.data, from: '2026-03-14T15:00:00.000Z', to: '2026-03-14T15:00:00.000Z' },
      regions: [
        { region: 'middle-belt', intensity: { min: 1e3, max: 1e6 } },
        { region: 'west-belt', intensity: { min: 1e3, max: 1e6 } },
      ],
    };
    const { run, preview } = await queueCheckedRun(net, config, null, 'test');
    // Three data per observed mode (frequency, peak power, half-width).
    expect(preview.nData % 3).toBe(0);
    const outcome = await executeRun(run.id, { solve: makeEngineSolver(1), workerId: 'modes' });
    expect(outcome, (await getRunById(run.id))?.error ?? '').toBe('finished');
    const [row] = await listRunIntervals(run.id);
    const res = row.result as unknown as InversionResult;
    expect(res.nData).toBe(preview.nData);
    expect(res.paramNames).toEqual(['Middle belt.intensity', 'West belt.intensity']);
    // Counts of starts per minimum add up to the number of starts.
    expect(res.minima.reduce((n, m) => n + m.count, 0)).toBe(config.starts);
  });
});
