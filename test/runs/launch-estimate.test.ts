/**
 * The set-up's time estimate against a real run on this machine. As on a fresh
 * `npm start`, the demo seeders store the demo day and solve the demo runs with
 * the real engine, recording each interval's duration; the estimate for a new,
 * different run (ten hours, more starts, a coarser band) then comes from that
 * measured speed, and the new run, solved as the worker solves it, takes between
 * half and twice the estimated time. A correctness check of the estimate (the
 * factor of two promised to the user), not a speed goal.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { closeDatabase, resetDatabase } from '@/test/helpers/db';
import * as accounts from '@/src/ops/seed/accounts';
import * as stations from '@/src/ops/seed/stations';
import * as runs from '@/src/ops/seed/runs';
import { createRun, getRunById, listRuns } from '@/db/repo/runs';
import { getRunView } from '@/src/runs/results';
import { checkLaunch } from '@/src/runs/launch';
import { executeRun } from '@/src/runs/execute';
import { engineSolver } from '@/src/runs/solver';
import { engineVersion } from '@/src/runs/engine-version';
import type { RunConfig } from '@/src/runs/config';

describe('time estimate of the run set-up', () => {
  beforeAll(async () => {
    await resetDatabase();
    await accounts.seed();
    await stations.seed();
    await runs.seed();
  }, 600_000);
  afterAll(closeDatabase);

  it('is within a factor of two of a real run, from the speed measured on this server', async () => {
    const net = await accounts.demoNetworkId();
    const demo = await getRunView(net, (await listRuns(net)).find((r) => r.name === runs.DEMO_RUN)!.id);
    const config: RunConfig = {
      ...demo.config,
      name: 'Ten hours, more starts',
      data: { ...demo.config.data, from: `${stations.DEMO_DAY}T12:00:00.000Z`, to: `${stations.DEMO_DAY}T22:00:00.000Z` },
      observables: { kind: 'spectrum', minHz: 6, maxHz: 26, every: 4 },
      starts: 6,
      seed: 7,
    };
    const { problems, preview } = await checkLaunch(net, config);
    expect(problems).toEqual([]);
    expect(preview!.estimateBasis).toBe('measured'); // the demo runs were solved and timed
    const run = await createRun({
      networkId: net,
      name: config.name,
      config: config as never,
      modelId: demo.model.id,
      gridId: demo.grid.id,
      engineVersion: engineVersion(),
      intervalStarts: preview!.intervalStarts,
      startsPerInterval: config.starts,
      createdBy: null,
    });
    const t0 = performance.now();
    expect(await executeRun(run.id, { solve: engineSolver, workerId: 'estimate-check' })).toBe('finished');
    const seconds = (performance.now() - t0) / 1000;
    expect((await getRunById(run.id))!.state).toBe('finished');
    const ratio = seconds / preview!.estimateSeconds;
    const said = `took ${seconds.toFixed(2)} s, estimated ${preview!.estimateSeconds.toFixed(2)} s`;
    console.log(`[estimate] ${said}`);
    expect(ratio, said).toBeGreaterThan(0.5);
    expect(ratio, said).toBeLessThan(2);
  }, 600_000);
});
