/**
 * Test scaffolding for runs: a user, a network, three stations of an invented
 * scenario (no real sites), a cavity model, a source grid, and noise-free
 * synthetic spectra of a known source stored as processed intervals.
 */
import { randomUUID } from 'node:crypto';
import { insertUser } from '@/db/repo/users';
import { createNetwork } from '@/db/repo/networks';
import type { GridInput } from '@/src/runs/grid-spec';
import { saveIntervals } from '@/db/repo/intervals';
import { queueCheckedRun } from '@/test/helpers/runs';
import type { Band } from '@/src/engine/band';
import type { Component } from '@/src/engine/components';
import type { Spectrum } from '@/src/engine/forward/types';
import {
  seedSyntheticNetwork,
  stationSpectra,
  syntheticRows,
  tenMinuteStarts,
  type HutSite,
  type SyntheticNetworkSpec,
} from '@/src/runs/synthetic-network';
import { logNormalStatistics } from '@/src/data/spectrum-statistics';

export const TRUTH = { name: 'East basin', lat: -3, lon: 22, intensity: 3e4 };
/** The true source as the forward model takes it. */
export const TRUTH_SOURCE = { lat: TRUTH.lat, lon: TRUTH.lon, intensity: TRUTH.intensity };
/** The first interval of every world: 2031-05-12 06:00 UTC (an invented day). */
export const DAY = Date.UTC(2031, 4, 12, 6, 0, 0);
export const CAVITY = { model: 'linear' as const, earthRadiusKm: 6371, heightKm: 60 };
export const BAND = { minHz: 6, maxHz: 30, stepHz: 0.5 };
/** A table cavity model (rows of frequency, then the propagation parameter's parts) on the 60 km linear model's Earth. */
export const tableModel = (rows: number[][]) => ({
  model: 'table' as const,
  earthRadiusKm: 6371,
  heightKm: 60,
  table: { columns: 'nu' as const, rows },
});
/** Welch segments per stored spectrum: sigma of ln P = 1/sqrt(K) = 0.1. */
export const SEGMENTS = 100;
/** Their stated scatter: independent, sigma of ln P = 1/sqrt(K) (spectra made by hand, not by Welch). */
export const STATISTICS = logNormalStatistics(1 / Math.sqrt(SEGMENTS));

const SITES = [
  { code: 'QX1', name: 'Northern ridge hut', latitude: 48.2, longitude: 10.5 },
  { code: 'QX2', name: 'Coastal plain hut', latitude: -30.4, longitude: 140.1 },
  { code: 'QX3', name: 'High desert hut', latitude: 35.3, longitude: -110.7 },
];

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

/** The east basin's unknowns in every world's run: intensity and a centre near the truth. */
export const EAST_BASIN_UNKNOWNS = {
  region: 'east-basin',
  intensity: { min: 1e2, max: 1e6 },
  lat: { min: -15, max: 15 },
  lon: { min: 5, max: 35 },
};

/** The synthetic network of the test worlds: huts at `sites`, CAVITY, GRID, noise-free spectra of the truth from DAY. */
export function worldSpec(
  networkId: string,
  userId: string,
  sites: readonly HutSite[],
  components: readonly Component[],
  intervalCount: number,
): SyntheticNetworkSpec {
  return {
    networkId,
    userId,
    sites,
    components,
    model: { name: 'Linear test', cavity: CAVITY },
    grid: GRID,
    band: BAND,
    starts: tenMinuteStarts(DAY, intervalCount),
    sources: [TRUTH_SOURCE],
    segments: SEGMENTS,
    run: { name: 'Round trip', regions: [EAST_BASIN_UNKNOWNS], scaleCovariance: false, starts: 4, seed: 7 },
  };
}

export async function makeRunWorld(intervalCount = 4) {
  const userId = `u-${randomUUID()}`;
  await insertUser({ id: userId, email: `${userId}@example.test`, name: 'Run tester', passwordHash: 'x' });
  const network = await createNetwork(`runs ${userId}`, userId);
  const made = await seedSyntheticNetwork(worldSpec(network.id, userId, SITES, ['Ez', 'Bns', 'Bew'], intervalCount));
  return { userId, networkId: network.id, ...made };
}

export type RunWorld = Awaited<ReturnType<typeof makeRunWorld>>;

/** A queued run of the world's configuration (or another one over the same network), checked as the launch route checks it. */
export async function newRun(w: RunWorld, config = w.config) {
  return (await queueCheckedRun(w.networkId, config, w.userId)).run;
}

/** Noise-free spectra of the true source at the world's stations. */
export const truthSpectra = (w: RunWorld, band: Band, components: readonly Component[]): Spectrum[] =>
  stationSpectra(w.stations, components, CAVITY, band, [TRUTH_SOURCE]);

/** Stores spectra of the world's stations at `t` as processed intervals of SEGMENTS segments. */
export async function storeSpectra(w: RunWorld, spectra: Spectrum[], t: Date, options: Parameters<typeof syntheticRows>[5] = {}) {
  await saveIntervals(syntheticRows(w.networkId, w.stations, spectra, t, SEGMENTS, options));
}
