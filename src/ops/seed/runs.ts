/**
 * Demo runs seeder: two cavity models (Ishaq–Jones and linear), a source grid
 * with the three invented tropical belts of the demo day as moving spot
 * regions plus a fixed region of land cells, and two finished runs on the demo
 * stations' data: the afternoon peak of the middle belt from spectra (14:00–16:00 UT) and a
 * short run from the stations' fitted modes (15:00–15:10 UT). Idempotent: models
 * and grid are matched by name; a run is matched by name and resumed if a
 * previous seeding stopped half-way. Everything here is invented.
 */
import { modelRepo } from '@/db/repo/models';
import { gridRepo } from '@/db/repo/grids';
import { getRunById, listRuns } from '@/db/repo/runs';
import { listStations } from '@/db/repo/stations';
import { saveGrid, saveModel } from '@/src/runs/catalogue';
import { checkLaunch, storeRun } from '@/src/runs/launch';
import { executeRun } from '@/src/runs/execute';
import { engineSolver } from '@/src/runs/solver';
import type { RunConfig } from '@/src/runs/config';
import type { GridInput } from '@/src/runs/grid-spec';
import { makeGlobalGrid } from '@/src/engine/sources/grid';
import { landCellsInBox } from '@/src/engine/sources/land-mask';
import { demoNetworkId } from './accounts';
import { DEMO_DAY } from './stations';
import { REGION_COLOURS } from '@/src/design/tokens';

export const DEMO_MODEL = 'Ishaq–Jones, 60 km';
export const DEMO_LINEAR_MODEL = 'Linear reference';
export const DEMO_GRID = 'Three tropical belts';
export const DEMO_RUN = 'Afternoon peak of the middle belt';
export const DEMO_MODE_RUN = 'Middle belt from fitted modes';

function demoGrid(): GridInput {
  const cell = 10;
  return {
    name: DEMO_GRID,
    notes: 'Demo grid: three moving belts and a fixed patch of land cells (invented scenario).',
    cellSizeDeg: cell,
    regions: [
      {
        key: 'west-belt',
        name: 'West belt',
        colour: REGION_COLOURS[0],
        kind: 'moving',
        centre: { lat: -6, lon: -58 },
        bounds: { lat: { min: -25, max: 15 }, lon: { min: -85, max: -35 } },
        spreadDeg: 10,
      },
      {
        key: 'middle-belt',
        name: 'Middle belt',
        colour: REGION_COLOURS[1],
        kind: 'moving',
        centre: { lat: 2, lon: 22 },
        bounds: { lat: { min: -20, max: 20 }, lon: { min: -5, max: 45 } },
        spreadDeg: 10,
      },
      {
        key: 'east-belt',
        name: 'East belt',
        colour: REGION_COLOURS[2],
        kind: 'moving',
        centre: { lat: 4, lon: 112 },
        bounds: { lat: { min: -15, max: 25 }, lon: { min: 90, max: 140 } },
        spreadDeg: 12,
      },
      {
        key: 'northern-patch',
        name: 'Northern land patch',
        colour: REGION_COLOURS[4],
        kind: 'cells',
        cells: landCellsInBox(makeGlobalGrid(cell), { latMin: 30, latMax: 50, lonMin: 60, lonMax: 100 }),
      },
    ],
  };
}

export async function seedDemoRuns(networkId: string): Promise<void> {
  const model =
    (await modelRepo.findByName(networkId, DEMO_MODEL)) ??
    (await saveModel(networkId, null, {
      name: DEMO_MODEL,
      notes: 'Demo model: Ishaq & Jones (1977) velocity and attenuation.',
      config: { model: 'ishaq-jones', earthRadiusKm: 6371, heightKm: 60 },
    }));
  if (!(await modelRepo.findByName(networkId, DEMO_LINEAR_MODEL))) {
    await saveModel(networkId, null, {
      name: DEMO_LINEAR_MODEL,
      notes: 'Demo model: the linear propagation parameter.',
      config: { model: 'linear', earthRadiusKm: 6371, heightKm: 60 },
    });
  }
  const grid = (await gridRepo.findByName(networkId, DEMO_GRID)) ?? (await saveGrid(networkId, null, demoGrid()));
  const stations = await listStations(networkId);
  const base: RunConfig = {
    name: DEMO_RUN,
    modelId: model.id,
    gridId: grid.id,
    data: {
      stationIds: stations.map((s) => s.id),
      components: ['Ez', 'Bns', 'Bew'],
      from: `${DEMO_DAY}T14:00:00.000Z`,
      to: `${DEMO_DAY}T16:00:00.000Z`,
      includeFlagged: false,
    },
    observables: { kind: 'spectrum', minHz: 6, maxHz: 26, every: 5 },
    regions: [
      { region: 'middle-belt', intensity: { min: 1e3, max: 1e6 }, lat: { min: -15, max: 15 }, lon: { min: 0, max: 40 } },
      { region: 'west-belt', intensity: { min: 1e3, max: 1e6 } },
      { region: 'east-belt', intensity: { min: 1e3, max: 1e6 } },
    ],
    damping: { initialLambda: 1e-2, maxIterations: 100 },
    scaleErrorsByMisfit: false,
    starts: 4,
    seed: 1,
  };
  await ensureRun(networkId, base);
  await ensureRun(networkId, {
    ...base,
    name: DEMO_MODE_RUN,
    observables: { kind: 'modes', modes: 3 },
    data: { ...base.data, from: `${DEMO_DAY}T15:00:00.000Z`, to: `${DEMO_DAY}T15:10:00.000Z` },
  });
}

/** Creates the run unless one of that name exists, and finishes it if it is not finished. */
async function ensureRun(networkId: string, config: RunConfig): Promise<void> {
  const existing = (await listRuns(networkId)).find((r) => r.name === config.name);
  let runId = existing?.id;
  if (!runId) {
    const { problems, preview } = await checkLaunch(networkId, config);
    if (problems.length || !preview)
      throw new Error(`demo run "${config.name}" cannot start: ${problems.map((p) => `${p.field}: ${p.message}`).join('; ')}`);
    const run = await storeRun(networkId, null, config, preview.intervalStarts);
    runId = run.id;
  }
  const run = await getRunById(runId);
  if (run && run.state !== 'finished') {
    // Solved as the worker solves (same threads), so its timings calibrate the set-up's time estimate.
    await executeRun(runId, { solve: engineSolver, workerId: 'demo-seeder', leaseSeconds: 0 });
  }
}

export async function seed(): Promise<void> {
  await seedDemoRuns(await demoNetworkId());
}
