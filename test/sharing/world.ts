/**
 * A solved run inside a network with the five test callers: three stations of
 * an invented scenario, a cavity model, a source grid with one moving and one
 * cell region, and synthetic spectra of a known source with seeded log-normal
 * scatter (sigma of ln P = 1/sqrt(K) for K Welch segments; Welch 1967), run
 * through the real driver and engine solver.
 */
import { saveIntervals } from '@/db/repo/intervals';
import { createRun } from '@/db/repo/runs';
import { createStation, type Station } from '@/db/repo/stations';
import { predictSpectra } from '@/src/engine/forward/predict';
import { gaussian, mulberry32 } from '@/src/engine/random';
import { saveGrid, saveModel } from '@/src/runs/catalogue';
import type { RunConfig } from '@/src/runs/config';
import { executeRun } from '@/src/runs/execute';
import { makeEngineSolver } from '@/src/runs/solver';
import { setupCallers, type AuthzWorld } from '@/test/helpers/authz';
import { BAND, CAVITY, GRID, SEGMENTS, STATISTICS, TRUTH } from '@/test/runs/world';

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
  const stations: Station[] = [];
  for (const s of SITES)
    stations.push(
      await createStation(w.networkId, {
        ...s,
        elevationM: 300,
        mainsHz: 50,
        interferenceLines: [],
        sampleRateHz: 200,
        notes: '',
        status: 'operating',
        components: [
          { component: 'Ez', calibration: { kind: 'gain', gain: 1 } },
          { component: 'Bns', calibration: { kind: 'gain', gain: 1 } },
        ],
      }),
    );
  const model = await saveModel(w.networkId, owner, { name: 'Linear test', notes: '', config: CAVITY });
  const grid = await saveGrid(w.networkId, owner, GRID);
  const spectra = predictSpectra({
    cavity: CAVITY,
    band: BAND,
    stations: stations.map((s) => ({ code: s.code, lat: s.latitude, lon: s.longitude, components: ['Ez', 'Bns'] as const })),
    sources: [{ lat: TRUTH.lat, lon: TRUTH.lon, intensity: TRUTH.intensity }],
  });
  const rand = mulberry32(noiseSeed);
  const sigma = 1 / Math.sqrt(SEGMENTS);
  const day = Date.UTC(2031, 4, 12, 6, 0, 0);
  const starts = Array.from({ length: intervalCount }, (_, i) => new Date(day + i * 600_000));
  await saveIntervals(
    starts.flatMap((t) =>
      spectra.map((sp) => ({
        networkId: w.networkId,
        stationId: stations.find((s) => s.code === sp.station)!.id,
        component: sp.component,
        startsAt: t,
        durationS: 600,
        origin: 'synthetic' as const,
        uploadId: null,
        rejectedShare: 0,
        qualityFlags: [],
        spectrum: {
          frequencies: sp.frequencies,
          power: sp.power.map((p) => p * Math.exp(sigma * gaussian(rand))),
          segments: SEGMENTS,
          statistics: STATISTICS,
        },
        fit: null,
      })),
    ),
  );
  const config: RunConfig = {
    name: 'Shared run',
    modelId: model.id,
    gridId: grid.id,
    data: {
      stationIds: stations.map((s) => s.id),
      components: ['Ez', 'Bns'],
      from: starts[0].toISOString(),
      to: starts.at(-1)!.toISOString(),
      includeFlagged: false,
    },
    observables: { kind: 'spectrum', minHz: BAND.minHz, maxHz: BAND.maxHz, every: 1 },
    regions: [
      { region: 'east-basin', intensity: { min: 1e2, max: 1e6 }, lat: { min: -15, max: 15 }, lon: { min: 5, max: 35 } },
      { region: 'west-shelf', intensity: { min: 1, max: 1e6 } },
    ],
    damping: { initialLambda: 1e-2, maxIterations: 200, scaleCovariance: true },
    starts: 4,
    seed: 7,
  };
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
