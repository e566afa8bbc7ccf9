/**
 * Test scaffolding for runs: a user, a network, three stations of an invented
 * scenario (no real sites), a cavity model, a source grid, and noise-free
 * synthetic spectra of a known source stored as processed intervals.
 */
import { randomUUID } from 'node:crypto';
import { insertUser } from '@/db/repo/users';
import { createNetwork } from '@/db/repo/networks';
import { createStation, type Station, type StationInput } from '@/db/repo/stations';
import { saveIntervals } from '@/db/repo/intervals';
import { predictSpectra } from '@/src/engine/forward/predict';
import { saveGrid, saveModel } from '@/src/runs/catalogue';
import type { GridInput } from '@/src/runs/grid-spec';
import type { RunConfig } from '@/src/runs/config';
import { logNormalStatistics } from '@/src/data/spectrum-statistics';

export const TRUTH = { name: 'East basin', lat: -3, lon: 22, intensity: 3e4 };
export const CAVITY = { model: 'linear' as const, earthRadiusKm: 6371, heightKm: 60 };
export const BAND = { minHz: 6, maxHz: 30, stepHz: 0.5 };
/** Welch segments per stored spectrum: sigma of ln P = 1/sqrt(K) = 0.1. */
export const SEGMENTS = 100;
/** Their stated scatter: independent, sigma of ln P = 1/sqrt(K) (spectra made by hand, not by Welch). */
export const STATISTICS = logNormalStatistics(1 / Math.sqrt(SEGMENTS));

const SITES = [
  { code: 'QX1', name: 'Northern ridge hut', latitude: 48.2, longitude: 10.5 },
  { code: 'QX2', name: 'Coastal plain hut', latitude: -30.4, longitude: 140.1 },
  { code: 'QX3', name: 'High desert hut', latitude: 35.3, longitude: -110.7 },
];

function station(site: (typeof SITES)[number]): StationInput {
  return {
    ...site,
    elevationM: 300,
    mainsHz: 50,
    interferenceLines: [],
    sampleRateHz: 200,
    notes: '',
    status: 'operating',
    components: [
      { component: 'Ez', calibration: { kind: 'gain', gain: 1 } },
      { component: 'Bns', calibration: { kind: 'gain', gain: 1 } },
      { component: 'Bew', calibration: { kind: 'gain', gain: 1 } },
    ],
  };
}

export const GRID: GridInput = {
  name: 'Test grid',
  notes: '',
  cellSizeDeg: 10,
  regions: [
    {
      key: 'east-basin',
      name: TRUTH.name,
      colour: '#eb476b',
      kind: 'moving',
      centre: { lat: 0, lon: 20 },
      bounds: { lat: { min: -20, max: 20 }, lon: { min: 0, max: 40 } },
      spreadDeg: 0,
    },
    { key: 'west-shelf', name: 'West shelf', colour: '#6dc4ff', kind: 'cells', cells: [300, 301] },
  ],
};

export async function makeRunWorld(intervalCount = 4) {
  const userId = `u-${randomUUID()}`;
  await insertUser({ id: userId, email: `${userId}@example.test`, name: 'Run tester', passwordHash: 'x' });
  const network = await createNetwork(`runs ${userId}`, userId);
  const stations: Station[] = [];
  for (const s of SITES) stations.push(await createStation(network.id, station(s)));
  const model = await saveModel(network.id, userId, { name: 'Linear test', notes: '', config: CAVITY });
  const grid = await saveGrid(network.id, userId, GRID);
  const spectra = predictSpectra({
    cavity: CAVITY,
    band: BAND,
    stations: stations.map((s) => ({
      code: s.code,
      lat: s.latitude,
      lon: s.longitude,
      components: ['Ez', 'Bns', 'Bew'] as const,
    })),
    sources: [{ lat: TRUTH.lat, lon: TRUTH.lon, intensity: TRUTH.intensity }],
  });
  const day = Date.UTC(2031, 4, 12, 6, 0, 0);
  const starts = Array.from({ length: intervalCount }, (_, i) => new Date(day + i * 600_000));
  await saveIntervals(
    starts.flatMap((t) =>
      spectra.map((sp) => ({
        networkId: network.id,
        stationId: stations.find((s) => s.code === sp.station)!.id,
        component: sp.component,
        startsAt: t,
        durationS: 600,
        origin: 'synthetic' as const,
        uploadId: null,
        rejectedShare: 0,
        qualityFlags: [],
        spectrum: { frequencies: sp.frequencies, power: sp.power, segments: SEGMENTS, statistics: STATISTICS },
        fit: null,
      })),
    ),
  );
  const config: RunConfig = {
    name: 'Round trip',
    modelId: model.id,
    gridId: grid.id,
    data: {
      stationIds: stations.map((s) => s.id),
      components: ['Ez', 'Bns', 'Bew'],
      from: starts[0].toISOString(),
      to: starts.at(-1)!.toISOString(),
      includeFlagged: false,
    },
    observables: { kind: 'spectrum', minHz: BAND.minHz, maxHz: BAND.maxHz, every: 1 },
    regions: [{ region: 'east-basin', intensity: { min: 1e2, max: 1e6 }, lat: { min: -15, max: 15 }, lon: { min: 5, max: 35 } }],
    damping: { initialLambda: 1e-2, maxIterations: 200, scaleCovariance: false },
    starts: 4,
    seed: 7,
  };
  return { userId, networkId: network.id, stations, model, grid, starts, config };
}
