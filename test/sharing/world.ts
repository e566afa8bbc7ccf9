/**
 * A solved run inside a network with the five test callers: three stations of
 * an invented scenario, a cavity model, a source grid with one moving and one
 * cell region, and synthetic spectra of a known source with seeded log-normal
 * scatter (sigma of ln P = 1/sqrt(K) for K Welch segments; Welch 1967), run
 * through the real driver and engine solver.
 */
import { afterAll, beforeAll } from 'vitest';
import { stopBoss } from '@/db/jobs';
import { closeDatabase, resetDatabase } from '@/test/helpers/db';
import { createRun } from '@/db/repo/runs';
import type { Station } from '@/db/repo/stations';
import type { RunConfig } from '@/src/runs/config';
import { seedSyntheticNetwork } from '@/src/runs/synthetic-network';
import { executeRun } from '@/src/runs/execute';
import { makeEngineSolver } from '@/src/runs/solver';
import { setupCallers, type AuthzWorld } from '@/test/helpers/authz';
import { EAST_BASIN_UNKNOWNS, worldSpec } from '@/test/runs/world';

const SITES = [
  { code: 'LK1', name: 'Lakeside hut', latitude: 48.2, longitude: 10.5 },
  { code: 'LK2', name: 'Dune hut', latitude: -30.4, longitude: 140.1 },
  { code: 'LK3', name: 'Mesa hut', latitude: 35.3, longitude: -110.7 },
];

export interface SharingWorld extends AuthzWorld {
  stations: Station[];
  runId: string;
  config: RunConfig;
  intervals: string[];
}

export async function makeSharingWorld(tag: string, intervalCount = 1, noiseSeed = 11): Promise<SharingWorld> {
  const w = await setupCallers(tag);
  const owner = w.callers.owner.userId!;
  const spec = worldSpec(w.networkId, owner, SITES, ['Ez', 'Bns'], intervalCount);
  const { stations, model, grid, starts, config } = await seedSyntheticNetwork({
    ...spec,
    noise: { kind: 'log-normal', seed: noiseSeed },
    run: {
      ...spec.run,
      name: 'Shared run',
      regions: [EAST_BASIN_UNKNOWNS, { region: 'west-shelf', intensity: { min: 1, max: 1e6 } }],
      scaleCovariance: true,
    },
  });
  const run = await createRun({
    networkId: w.networkId,
    name: config.name,
    config: config as never,
    modelId: model.id,
    gridId: grid.id,
    engineVersion: 'test',
    intervalStarts: starts.map((t) => t.toISOString()),
    startsPerInterval: config.starts,
    createdBy: owner,
  });
  const outcome = await executeRun(run.id, { solve: makeEngineSolver(1), workerId: `sharing-${tag}` });
  if (outcome !== 'finished') throw new Error(`the test run ended ${outcome}`);
  return { ...w, stations, runId: run.id, config, intervals: starts.map((t) => t.toISOString()) };
}

/**
 * A fresh database with one sharing world for a test file: made before its tests, the job queue
 * and the pool closed after them. Read `world()` inside the tests.
 */
export function withSharingWorld(tag: string, intervalCount = 1): () => SharingWorld {
  let w: SharingWorld | null = null;
  beforeAll(async () => {
    await resetDatabase();
    w = await makeSharingWorld(tag, intervalCount);
  });
  afterAll(async () => {
    await stopBoss(5000);
    await closeDatabase();
  });
  return () => w!;
}
