/** The demo runs seeder: a model, a grid and one finished run on the demo stations' data; running it again changes nothing. */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { closeDatabase, resetDatabase } from '@/test/helpers/db';
import * as accounts from '@/src/ops/seed/accounts';
import * as stations from '@/src/ops/seed/stations';
import * as runs from '@/src/ops/seed/runs';
import { listModels } from '@/db/repo/models';
import { listGrids } from '@/db/repo/grids';
import { listRunIntervals, listRuns } from '@/db/repo/runs';
import type { InversionResult } from '@/src/engine/inverse/types';

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
    expect(await listModels(net)).toHaveLength(2);
    expect(await listGrids(net)).toHaveLength(1);
  });
});
