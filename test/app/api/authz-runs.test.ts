/**
 * Authorization matrix for the runs API (cavity models, source grids, runs,
 * results, fits, exports, misfit surfaces): every route × every caller
 * against the expected status. Rules from the permission table
 * (src/auth/permissions.ts): viewers read and export, analysts also edit
 * models and grids and launch/cancel runs, owners also delete runs; members
 * of another network get 404 (common practice: other networks' ids are not
 * confirmed). Then the refusals of bad input, each naming its field.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { closeDatabase, resetDatabase } from '@/test/helpers/db';
import { CALLERS, call, errorOf, setupCallers, type AuthzWorld, type CallerName } from '@/test/helpers/authz';
import { stopBoss } from '@/db/jobs';
import { createRun, endRun, listRunIntervals } from '@/db/repo/runs';
import { createStation } from '@/db/repo/stations';
import { saveIntervals } from '@/db/repo/intervals';
import { hutInput, stationSpectra, syntheticRows } from '@/src/runs/synthetic-network';
import { saveGrid, saveModel } from '@/src/runs/catalogue';
import { executeRun } from '@/src/runs/execute';
import { splitRun } from '@/src/runs/chunks';
import { makeEngineSolver } from '@/src/runs/solver';
import type { RunConfig } from '@/src/runs/config';
import * as modelsRoute from '@/app/api/networks/[networkId]/models/route';
import * as modelRoute from '@/app/api/networks/[networkId]/models/[modelId]/route';
import * as gridsRoute from '@/app/api/networks/[networkId]/grids/route';
import * as gridRoute from '@/app/api/networks/[networkId]/grids/[gridId]/route';
import * as runsRoute from '@/app/api/networks/[networkId]/runs/route';
import * as checkRoute from '@/app/api/networks/[networkId]/runs/check/route';
import * as runRoute from '@/app/api/networks/[networkId]/runs/[runId]/route';
import * as cancelRoute from '@/app/api/networks/[networkId]/runs/[runId]/cancel/route';
import * as rerunRoute from '@/app/api/networks/[networkId]/runs/[runId]/rerun/route';
import * as pauseRoute from '@/app/api/networks/[networkId]/runs/[runId]/pause/route';
import * as exportRoute from '@/app/api/networks/[networkId]/runs/[runId]/export/route';
import * as fitsRoute from '@/app/api/networks/[networkId]/runs/[runId]/fits/route';
import * as surfacesRoute from '@/app/api/networks/[networkId]/runs/[runId]/surfaces/route';
import * as surfaceRoute from '@/app/api/networks/[networkId]/runs/[runId]/surfaces/[surfaceId]/route';
import { CAVITY, GRID, BAND, SEGMENTS, TRUTH, tableModel } from '@/test/runs/world';

let w: AuthzWorld;
let modelId = '';
let gridId = '';
let runId = '';
let surfaceId = '';
let config: RunConfig;
let interval = '';

const MODEL = { name: 'Authz model', notes: '', config: CAVITY };

beforeAll(async () => {
  await resetDatabase();
  w = await setupCallers('runs');
  const st = await createStation(
    w.networkId,
    hutInput({ code: 'AZ1', name: 'Authz hut', latitude: 40, longitude: -20 }, ['Ez', 'Bns'], null),
  );
  interval = '2031-05-12T06:00:00.000Z';
  const spectra = stationSpectra([st], ['Ez', 'Bns'], CAVITY, BAND, [TRUTH]);
  await saveIntervals(syntheticRows(w.networkId, [st], spectra, new Date(interval), SEGMENTS));
  modelId = (await saveModel(w.networkId, w.callers.owner.userId, MODEL)).id;
  gridId = (await saveGrid(w.networkId, w.callers.owner.userId, GRID)).id;
  config = {
    name: 'Authz run',
    modelId,
    gridId,
    data: { stationIds: [st.id], components: ['Ez', 'Bns'], from: interval, to: interval, includeFlagged: false },
    observables: { kind: 'spectrum', minHz: 6, maxHz: 30, every: 1 },
    regions: [{ region: 'east-basin', intensity: { min: 1e2, max: 1e6 }, lat: { min: -15, max: 15 }, lon: { min: 5, max: 35 } }],
    damping: { initialLambda: 0.01, maxIterations: 100, scaleCovariance: false },
    starts: 2,
    seed: 3,
  };
  runId = (await freshRun()).id;
  await executeRun(runId, { solve: makeEngineSolver(1), workerId: 'authz' });
  expect(await listRunIntervals(runId)).toHaveLength(1);
  const res = await call(surfacesRoute.POST, w.callers.owner, {
    method: 'POST',
    params: R(),
    body: { interval, x: 'East basin.lat', y: 'East basin.lon', points: 5 },
  });
  surfaceId = ((await res.json()) as { surface: { id: string } }).surface.id;
});
afterAll(async () => {
  await stopBoss(5000);
  await closeDatabase();
});

function freshRun() {
  return createRun({
    networkId: w.networkId,
    name: 'fresh',
    config: config as never,
    modelId,
    gridId,
    engineVersion: 'test',
    intervalStarts: [interval],
    startsPerInterval: 2,
    createdBy: null,
  });
}
async function endedRun(state: 'finished' | 'cancelled') {
  const r = await freshRun();
  await endRun(r.id, state, null);
  return r.id;
}

/** A fresh run cut into chunks (only such a run can be paused). */
async function chunkedRun() {
  const r = await freshRun();
  await splitRun(r.id, r.intervalStarts.length);
  return r.id;
}

const P = () => ({ networkId: w.networkId });
const R = (id = runId) => ({ networkId: w.networkId, runId: id });

type Row = { name: string; expect: [number, number, number, number, number]; run: (c: CallerName) => Promise<Response> };
const READ: Row['expect'] = [401, 200, 200, 200, 404];
const EDIT = (ok: number): Row['expect'] => [401, 403, ok, ok, 404];

const rows: Row[] = [
  { name: 'GET models', expect: READ, run: (c) => call(modelsRoute.GET, w.callers[c], { params: P() }) },
  {
    name: 'POST models',
    expect: EDIT(201),
    run: (c) => call(modelsRoute.POST, w.callers[c], { method: 'POST', params: P(), body: MODEL }),
  },
  { name: 'GET model', expect: READ, run: (c) => call(modelRoute.GET, w.callers[c], { params: { ...P(), modelId } }) },
  {
    name: 'POST model version',
    expect: EDIT(201),
    run: (c) => call(modelRoute.POST, w.callers[c], { method: 'POST', params: { ...P(), modelId }, body: MODEL }),
  },
  { name: 'GET grids', expect: READ, run: (c) => call(gridsRoute.GET, w.callers[c], { params: P() }) },
  {
    name: 'POST grids',
    expect: EDIT(201),
    run: (c) => call(gridsRoute.POST, w.callers[c], { method: 'POST', params: P(), body: GRID }),
  },
  { name: 'GET grid', expect: READ, run: (c) => call(gridRoute.GET, w.callers[c], { params: { ...P(), gridId } }) },
  {
    name: 'POST grid version',
    expect: EDIT(201),
    run: (c) => call(gridRoute.POST, w.callers[c], { method: 'POST', params: { ...P(), gridId }, body: GRID }),
  },
  { name: 'GET runs', expect: READ, run: (c) => call(runsRoute.GET, w.callers[c], { params: P() }) },
  {
    name: 'POST runs (launch)',
    expect: EDIT(202),
    run: (c) => call(runsRoute.POST, w.callers[c], { method: 'POST', params: P(), body: config }),
  },
  {
    name: 'POST runs/check',
    expect: EDIT(200),
    run: (c) => call(checkRoute.POST, w.callers[c], { method: 'POST', params: P(), body: config }),
  },
  { name: 'GET run', expect: READ, run: (c) => call(runRoute.GET, w.callers[c], { params: R() }) },
  {
    name: 'DELETE run',
    expect: [401, 403, 403, 200, 404],
    run: async (c) => call(runRoute.DELETE, w.callers[c], { method: 'DELETE', params: R(await endedRun('finished')) }),
  },
  {
    name: 'POST cancel',
    expect: EDIT(200),
    run: async (c) => call(cancelRoute.POST, w.callers[c], { method: 'POST', params: R((await freshRun()).id) }),
  },
  {
    name: 'POST pause',
    expect: EDIT(202),
    run: async (c) =>
      call(pauseRoute.POST, w.callers[c], { method: 'POST', params: R(await chunkedRun()), body: { paused: true } }),
  },
  {
    name: 'POST rerun',
    expect: EDIT(202),
    run: async (c) => call(rerunRoute.POST, w.callers[c], { method: 'POST', params: R(await endedRun('cancelled')) }),
  },
  {
    name: 'GET export csv',
    expect: READ,
    run: (c) => call(exportRoute.GET, w.callers[c], { params: R(), path: '/x?format=csv&what=series' }),
  },
  {
    name: 'GET export json',
    expect: READ,
    run: (c) => call(exportRoute.GET, w.callers[c], { params: R(), path: '/x?format=json' }),
  },
  {
    name: 'GET fits',
    expect: READ,
    run: (c) => call(fitsRoute.GET, w.callers[c], { params: R(), path: `/x?interval=${interval}&minimum=0` }),
  },
  {
    name: 'POST surfaces',
    expect: EDIT(202),
    run: (c) =>
      call(surfacesRoute.POST, w.callers[c], {
        method: 'POST',
        params: R(),
        body: { interval, x: 'East basin.intensity', y: 'East basin.lat', points: 5 },
      }),
  },
  { name: 'GET surface', expect: READ, run: (c) => call(surfaceRoute.GET, w.callers[c], { params: { ...R(), surfaceId } }) },
];

describe('runs API authorization', () => {
  for (const row of rows) {
    it(`${row.name}: anonymous, viewer, analyst, owner, other network → ${row.expect.join(', ')}`, async () => {
      const got: number[] = [];
      for (const c of CALLERS) got.push((await row.run(c)).status);
      expect(got).toEqual(row.expect);
    });
  }
});

describe('runs API refuses bad input with the error shape', () => {
  it('a table model whose frequencies do not increase', async () => {
    const res = await call(modelsRoute.POST, w.callers.analyst, {
      method: 'POST',
      params: P(),
      body: {
        name: 'T',
        config: tableModel([
          [8, 1, -0.1],
          [7, 1.2, -0.2],
        ]),
      },
    });
    expect(res.status).toBe(400);
    const e = await errorOf(res);
    expect(e.field).toBe('config.table.rows.1.0');
    expect(e.message).toMatch(/strictly increasing/);
  });

  it('a grid with a region without cells', async () => {
    const res = await call(gridsRoute.POST, w.callers.analyst, {
      method: 'POST',
      params: P(),
      body: { ...GRID, regions: [{ ...GRID.regions[1], cells: [] }] },
    });
    expect(res.status).toBe(400);
    expect((await errorOf(res)).field).toBe('regions.0.cells');
  });

  it('a launch whose bounds leave the grid region', async () => {
    const res = await call(runsRoute.POST, w.callers.analyst, {
      method: 'POST',
      params: P(),
      body: { ...config, regions: [{ ...config.regions[0], lat: { min: -40, max: 0 } }] },
    });
    expect(res.status).toBe(400);
    expect((await errorOf(res)).field).toBe('regions.0.lat');
  });

  it('a launch with more free parameters than data', async () => {
    const res = await call(runsRoute.POST, w.callers.analyst, {
      method: 'POST',
      params: P(),
      body: { ...config, data: { ...config.data, components: ['Ez'] }, observables: { kind: 'spectrum', minHz: 6, maxHz: 6.5 } },
    });
    expect(res.status).toBe(400);
    expect((await errorOf(res)).message).toMatch(/too many free parameters/);
  });

  it('a launch over a range without data, and malformed JSON', async () => {
    const res = await call(runsRoute.POST, w.callers.analyst, {
      method: 'POST',
      params: P(),
      body: { ...config, data: { ...config.data, from: '2030-01-01T00:00:00Z', to: '2030-01-01T01:00:00Z' } },
    });
    expect(res.status).toBe(400);
    expect((await errorOf(res)).field).toBe('data.from');
    const bad = await call(runsRoute.POST, w.callers.analyst, { method: 'POST', params: P(), rawBody: '{"name":' });
    expect(bad.status).toBe(400);
  });

  it('a run id that is not a run, or a run of another network, is a 404', async () => {
    expect((await call(runRoute.GET, w.callers.owner, { params: R('not-a-run') })).status).toBe(404);
    expect((await call(runRoute.GET, w.callers.otherOwner, { params: { networkId: w.otherNetworkId, runId } })).status).toBe(404);
  });

  it('pausing a finished run is a conflict that says why; a pause without `paused` is a 400 naming it', async () => {
    const res = await call(pauseRoute.POST, w.callers.analyst, { method: 'POST', params: R(), body: { paused: true } });
    expect(res.status).toBe(409);
    expect((await errorOf(res)).message).toBe('Only a queued or running run can be paused; this one is finished.');
    const bad = await call(pauseRoute.POST, w.callers.analyst, { method: 'POST', params: R(await chunkedRun()), body: {} });
    expect(bad.status).toBe(400);
    expect((await errorOf(bad)).field).toBe('paused');
  });

  it('cancelling a finished run is a conflict that changes nothing', async () => {
    const res = await call(cancelRoute.POST, w.callers.analyst, { method: 'POST', params: R() });
    expect(res.status).toBe(409);
    expect(await listRunIntervals(runId)).toHaveLength(1);
  });
});
