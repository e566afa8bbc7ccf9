/**
 * The compare page's data for two picks of stored runs: a run against itself
 * agrees everywhere (differences 0, no setting marked), picks default to the
 * last solved interval's best minimum, and a run of another network is not
 * found (common practice: foreign ids are not confirmed). The fit of a chosen
 * minimum per station and component adds up to its misfit (chi-square is a
 * sum over the series; the series' degrees of freedom add up to the
 * interval's, nData - nParams), for the best minimum (recorded by the solver)
 * and for any other (worked out again).
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { closeDatabase, resetDatabase } from '@/test/helpers/db';
import { stopBoss } from '@/db/jobs';
import { eq } from 'drizzle-orm';
import { getDb } from '@/db/client';
import { runIntervals } from '@/db/schema';
import { loadComparison, type Comparison } from '@/src/runs/compare-load';
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

  it('the fit per station and component adds up to the chosen minimum', async () => {
    const check = (c: Comparison) => {
      for (const p of [c.a, c.b]) {
        expect(p.fit.length).toBeGreaterThan(0);
        const chi2 = p.fit.reduce((s, f) => s + f.chi2, 0);
        expect(Math.abs(chi2 - p.minimum!.misfit) / p.minimum!.misfit).toBeLessThan(1e-9);
        for (const f of p.fit) expect(f.p).toBeGreaterThanOrEqual(0);
        expect(p.stations.map((s) => s.station).sort()).toEqual(['LK1', 'LK2', 'LK3']);
      }
    };
    const recorded = await loadComparison(w.networkId, { runId: w.runId, interval: w.intervals[0] }, { runId: w.runId });
    check(recorded);
    expect(recorded.colours['East basin']).toBeDefined();
    expect(recorded.logRange!.hi).toBeGreaterThan(recorded.logRange!.lo);
    // An interval solved before series misfits were kept: they are worked out again, to the same values.
    const [row] = await getDb().select().from(runIntervals).where(eq(runIntervals.runId, w.runId)).orderBy(runIntervals.startsAt);
    const { seriesMisfits: _kept, ...rest } = row.result as Record<string, unknown>;
    await getDb().update(runIntervals).set({ result: rest }).where(eq(runIntervals.id, row.id));
    const again = await loadComparison(w.networkId, { runId: w.runId, interval: w.intervals[0] }, { runId: w.runId });
    check(again);
    for (const [k, f] of again.a.fit.entries()) expect(f.chi2).toBeCloseTo(recorded.a.fit[k].chi2, 8);
    await getDb().update(runIntervals).set({ result: row.result }).where(eq(runIntervals.id, row.id));
  });

  it('a run of another network is not found', async () => {
    await expect(loadComparison(w.otherNetworkId, { runId: w.runId }, { runId: w.runId })).rejects.toMatchObject({ status: 404 });
  });
});
