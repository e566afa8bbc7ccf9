/**
 * The compare page's data for two picks of stored runs: a run against itself
 * agrees everywhere (differences 0, no setting marked), picks default to the
 * last solved interval's best minimum, and a run of another network is not
 * found (common practice: foreign ids are not confirmed).
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { closeDatabase, resetDatabase } from '@/test/helpers/db';
import { stopBoss } from '@/db/jobs';
import { loadComparison } from '@/src/runs/compare-load';
import { makeSharingWorld, type SharingWorld } from '@/test/sharing/world';

let w: SharingWorld;
beforeAll(async () => {
  await resetDatabase();
  w = await makeSharingWorld('compare', 2);
});
afterAll(async () => {
  await stopBoss(5000);
  await closeDatabase();
});

describe('loadComparison', () => {
  it('a run against itself: same minimum, no differences', async () => {
    const c = await loadComparison(w.networkId, { runId: w.runId }, { runId: w.runId, interval: w.intervals[1], minimum: 0 });
    expect(c.a.interval).toBe(w.intervals[1]);
    expect(c.a.minimum).toEqual(c.b.minimum);
    expect(c.settings.some((r) => r.differs)).toBe(false);
    expect(c.settings.find((r) => r.label === 'Stations')!.a).toBe('LK1, LK2, LK3');
    expect(c.parameters.map((p) => p.name)).toEqual([
      'East basin.intensity',
      'East basin.lat',
      'East basin.lon',
      'West shelf.intensity',
    ]);
    for (const p of c.parameters) expect(p).toMatchObject({ difference: 0, z: 0, agreement: 'agree' });
  });

  it('another interval of the same run is a different minimum', async () => {
    const c = await loadComparison(
      w.networkId,
      { runId: w.runId, interval: w.intervals[0] },
      { runId: w.runId, interval: w.intervals[1] },
    );
    expect(c.parameters.some((p) => p.difference !== 0)).toBe(true);
  });

  it('a run of another network is not found', async () => {
    await expect(loadComparison(w.otherNetworkId, { runId: w.runId }, { runId: w.runId })).rejects.toMatchObject({ status: 404 });
  });
});
