/**
 * Loading a run's observations several intervals per query gives each interval
 * exactly what loading it alone gives (same series, same order), including an
 * interval with a flagged series left out and a time with no data at all.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { closeDatabase, resetDatabase } from '@/test/helpers/db';
import { listIntervals, setIntervalFlag } from '@/db/repo/intervals';
import { intervalLoader, loadSpectrumObservations, loadSpectrumObservationsOf } from '@/src/runs/observations';
import { makeRunWorld } from './world';

describe('observations of several intervals at once', () => {
  beforeAll(resetDatabase);
  afterAll(closeDatabase);

  it('match interval-by-interval loading, bucket by bucket', async () => {
    const w = await makeRunWorld(5);
    const rows = await listIntervals({ networkId: w.networkId, from: w.starts[2], to: new Date(w.starts[2].getTime() + 1) });
    expect(await setIntervalFlag(w.networkId, rows[0].id, { reason: 'test: cattle at the electrode', userId: w.userId })).not.toBeNull();
    const empty = new Date(w.starts[4].getTime() + 3_600_000);
    const times = [...w.starts, empty];
    const batch = await loadSpectrumObservationsOf(w.networkId, w.config, times);
    for (const t of times) expect(batch.get(t.getTime())).toEqual(await loadSpectrumObservations(w.networkId, w.config, t));
    expect(times.map((t) => batch.get(t.getTime())!.length)).toEqual([9, 9, 8, 9, 9, 0]);

    const load = intervalLoader(w.networkId, w.config, times, 2);
    for (const t of times) expect((await load(t)).observed).toEqual(await loadSpectrumObservations(w.networkId, w.config, t));
  });
});
