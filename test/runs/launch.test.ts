/**
 * Launch checks against stored data: every bad configuration is refused with
 * a message naming its field, and a good one is stored and queued with its
 * configuration and engine version. Grid and model edits make versions.
 */
import { afterAll, beforeEach, describe, expect, it } from 'vitest';
import { closeQueueAndDatabase, resetDatabase } from '@/test/helpers/db';
import { createRun, getRunById, recentIntervalTimings, saveRunInterval } from '@/db/repo/runs';
import { modelRepo } from '@/db/repo/models';
import { checkLaunch, launchRun } from '@/src/runs/launch';
import { saveGrid, saveModel } from '@/src/runs/catalogue';
import { AppError } from '@/src/server/errors';
import { makeRunWorld, GRID, tableModel } from './world';

async function problemsOf(w: Awaited<ReturnType<typeof makeRunWorld>>, patch: (c: typeof w.config) => void) {
  const c = structuredClone(w.config);
  patch(c);
  return (await checkLaunch(w.networkId, c)).problems;
}

describe('launch checks', () => {
  beforeEach(resetDatabase);
  afterAll(() => closeQueueAndDatabase());

  it('previews data, parameters, starts and intervals of a good configuration', async () => {
    const w = await makeRunWorld(3);
    const { problems, preview } = await checkLaunch(w.networkId, w.config);
    expect(problems).toEqual([]);
    // 3 stations x 3 components x 49 bins (6..30 Hz every 0.5 Hz, both ends included).
    expect(preview!.nData).toBe(3 * 3 * 49);
    expect(preview!.nParams).toBe(3);
    expect(preview!.intervals).toBe(3);
    expect(preview!.estimateSeconds).toBeGreaterThan(0);
  });

  it("bases the time estimate on the network's own finished intervals once there are some", async () => {
    const w = await makeRunWorld(1);
    const { preview } = await checkLaunch(w.networkId, w.config);
    const run = await createRun({
      networkId: w.networkId,
      name: 'measured',
      config: w.config as never,
      modelId: w.model.id,
      gridId: w.grid.id,
      engineVersion: 'test',
      intervalStarts: preview!.intervalStarts,
      startsPerInterval: 4,
      createdBy: null,
    });
    // One stored interval that took 10 s for 100 data x 2 parameters x 5 starts: 0.01 s per unit.
    await saveRunInterval(
      run.id,
      { startsAt: new Date(preview!.intervalStarts[0]), nData: 100, seconds: 10, result: { nParams: 2, starts: 5, minima: [] } },
      run.progress,
    );
    const again = await checkLaunch(w.networkId, w.config);
    expect(again.preview!.estimateSeconds).toBeCloseTo(1 * 4 * (3 * 3 * 49) * 3 * 0.01, 6);
    // A spectrum run's cost says nothing about a mode run's (each predicted spectrum is fitted).
    expect(again.preview!.estimateBasis).toBe('measured');
    expect(await recentIntervalTimings(w.networkId, 'spectrum')).toHaveLength(1);
    expect(await recentIntervalTimings(w.networkId, 'modes')).toEqual([]);
  });

  it('refuses a centre range outside the region bounds of the grid', async () => {
    const w = await makeRunWorld(1);
    const p = await problemsOf(w, (c) => {
      c.regions[0].lon = { min: -10, max: 35 };
    });
    expect(p[0].field).toBe('regions.0.lon');
    expect(p[0].message).toMatch(/leaves the region's bounds/);
  });

  it('refuses a range without data, and flagged-only data unless asked', async () => {
    const w = await makeRunWorld(1);
    const p = await problemsOf(w, (c) => {
      c.data.from = '2031-06-01T00:00:00.000Z';
      c.data.to = '2031-06-02T00:00:00.000Z';
    });
    expect(p[0]).toEqual({ field: 'data.from', message: expect.stringMatching(/no unflagged data/) });
  });

  it('refuses more free parameters than data', async () => {
    const w = await makeRunWorld(1);
    const p = await problemsOf(w, (c) => {
      c.data.stationIds = [w.stations[0].id];
      c.data.components = ['Ez'];
      c.observables = { kind: 'spectrum', minHz: 7, maxHz: 7.5, every: 1 };
    });
    expect(p[0].field).toBe('regions');
    expect(p[0].message).toMatch(/too many free parameters \(3\) for the data \(2/);
  });

  it('refuses a region that is not in the grid and a fixed-cell region with a free centre', async () => {
    const w = await makeRunWorld(1);
    const p1 = await problemsOf(w, (c) => {
      c.regions[0].region = 'nowhere';
    });
    expect(p1[0].field).toBe('regions.0.region');
    const p2 = await problemsOf(w, (c) => {
      c.regions = [{ region: 'west-shelf', intensity: { min: 1, max: 1e6 }, lat: { min: 0, max: 1 } }];
    });
    expect(p2[0].field).toBe('regions.0.lat');
  });

  it('launchRun stores the configuration and engine version and queues the run; a bad one is a 400 naming the field', async () => {
    const w = await makeRunWorld(2);
    const run = await launchRun(w.networkId, w.userId, w.config);
    const stored = await getRunById(run.id);
    expect(stored!.state).toBe('queued');
    expect(stored!.config).toMatchObject({ name: 'Round trip', starts: 4, seed: 7 });
    expect(stored!.engineVersion).toMatch(/^\d+\.\d+\.\d+\+[0-9a-f]{12}$/);
    expect(stored!.intervalStarts).toHaveLength(2);
    const bad = structuredClone(w.config);
    bad.regions[0].lat = { min: -40, max: 10 };
    const err = await launchRun(w.networkId, w.userId, bad).catch((e) => e);
    expect(err).toBeInstanceOf(AppError);
    expect(err.status).toBe(400);
    expect(err.field).toBe('regions.0.lat');
  });

  it('editing a model or grid adds a version and leaves the pinned one unchanged', async () => {
    const w = await makeRunWorld(1);
    const v2 = await saveModel(
      w.networkId,
      w.userId,
      { name: 'Linear test', notes: 'taller', config: { model: 'linear', earthRadiusKm: 6371, heightKm: 70 } },
      w.model.id,
    );
    expect(v2.version).toBe(2);
    expect(v2.lineageId).toBe(w.model.lineageId);
    const versions = await modelRepo.listVersions(w.networkId, w.model.id);
    expect(versions.map((v) => v.version)).toEqual([2, 1]);
    expect((versions[1].config as { heightKm: number }).heightKm).toBe(60);
    const g2 = await saveGrid(w.networkId, w.userId, { ...GRID, cellSizeDeg: 5, regions: [GRID.regions[0]] }, w.grid.id);
    expect(g2.version).toBe(2);
  });

  it('refuses a table model whose frequencies do not increase, naming the row', async () => {
    const { modelInputSchema } = await import('@/src/runs/model-spec');
    const parsed = modelInputSchema.safeParse({
      name: 'Bad table',
      config: tableModel([
        [5, 0.5, -0.1],
        [4, 1, -0.2],
      ]),
    });
    expect(parsed.success).toBe(false);
    expect(parsed.error!.issues[0].message).toMatch(/row 1: frequencies must be strictly increasing/);
  });

  it('refuses overlapping and empty cell regions', async () => {
    const w = await makeRunWorld(1);
    const overlap = {
      ...GRID,
      regions: [GRID.regions[1], { ...GRID.regions[1], key: 'other', name: 'Other', cells: [301, 302] }],
    };
    await expect(saveGrid(w.networkId, w.userId, overlap)).rejects.toThrow(/overlap \(cell 301\)/);
    const empty = { ...GRID, regions: [{ ...GRID.regions[1], cells: [] }] };
    await expect(saveGrid(w.networkId, w.userId, empty)).rejects.toThrow(/has no cells/);
  });
});
