/**
 * A network of invented huts with synthetic stored spectra, ready for a run: the stations (unit gain,
 * 200 Hz, 50 Hz mains), a cavity model, a source grid, 10-minute intervals of forward-model spectra of
 * given sources, optionally scattered as a K-segment Welch average would be, and a spectrum run's
 * configuration over all of it. Shared by the benchmarks and the tests, so that each seeds the same way.
 */
import { saveIntervals, type IntervalResultInput } from '@/db/repo/intervals';
import { createStation, type Station, type StationInput } from '@/db/repo/stations';
import type { Band } from '@/src/engine/band';
import type { CavityConfig } from '@/src/engine/cavity/types';
import type { Component } from '@/src/engine/components';
import { predictSpectra } from '@/src/engine/forward/predict';
import type { Spectrum } from '@/src/engine/forward/types';
import { gammaDeviate, gaussian, mulberry32 } from '@/src/engine/random';
import type { ForwardSource } from '@/src/engine/sources/types';
import { logNormalStatistics } from '@/src/data/spectrum-statistics';
import { saveGrid, saveModel, type GridRow, type ModelRow } from './catalogue';
import type { RunConfig } from './config';
import type { GridInput } from './grid-spec';

export type HutSite = Pick<StationInput, 'code' | 'name' | 'latitude' | 'longitude'>;

/** An invented hut: unit-gain sensors on the given components, 200 Hz, 50 Hz mains, no listed lines. */
export function hutInput(site: HutSite, components: readonly Component[], elevationM: number | null = 300): StationInput {
  return {
    ...site,
    elevationM,
    mainsHz: 50,
    interferenceLines: [],
    sampleRateHz: 200,
    notes: '',
    status: 'operating',
    components: components.map((component) => ({ component, calibration: { kind: 'gain' as const, gain: 1 } })),
  };
}

/** A region's box: its key, name, colour and latitude/longitude ranges. */
export interface RegionBox {
  key: string;
  name: string;
  colour: string;
  lat: { min: number; max: number };
  lon: { min: number; max: number };
}

/** A moving point region free inside its box, starting at the box's middle. */
export const boxRegion = (r: RegionBox): GridInput['regions'][number] => ({
  key: r.key,
  name: r.name,
  colour: r.colour,
  kind: 'moving' as const,
  spreadDeg: 0,
  centre: { lat: (r.lat.min + r.lat.max) / 2, lon: (r.lon.min + r.lon.max) / 2 },
  bounds: { lat: r.lat, lon: r.lon },
});

/** `count` consecutive 10-minute interval starts from `fromMs`. */
export const tenMinuteStarts = (fromMs: number, count: number): Date[] =>
  Array.from({ length: count }, (_, i) => new Date(fromMs + i * 600_000));

/** Forward-model spectra of the sources at the stations, every listed component of each. */
export function stationSpectra(
  stations: readonly Station[],
  components: readonly Component[],
  cavity: CavityConfig,
  band: Band,
  sources: readonly ForwardSource[],
): Spectrum[] {
  return predictSpectra({
    cavity,
    band,
    stations: stations.map((s) => ({ code: s.code, lat: s.latitude, lon: s.longitude, components })),
    sources,
  });
}

/**
 * Stored-interval rows of synthetic spectra at one time: power as given (or as `power` changes it), K
 * segments with the independent log-normal scatter sigma of ln P = 1/sqrt(K) stated (Welch 1967).
 */
export function syntheticRows(
  networkId: string,
  stations: readonly Station[],
  spectra: readonly Spectrum[],
  startsAt: Date,
  segments: number,
  options: { power?: (sp: Spectrum, k: number) => number[]; fit?: (sp: Spectrum, k: number) => IntervalResultInput['fit'] } = {},
): IntervalResultInput[] {
  const statistics = logNormalStatistics(1 / Math.sqrt(segments));
  return spectra.map((sp, k) => ({
    networkId,
    stationId: stations.find((s) => s.code === sp.station)!.id,
    component: sp.component,
    startsAt,
    durationS: 600,
    origin: 'synthetic' as const,
    uploadId: null,
    rejectedShare: 0,
    qualityFlags: [],
    spectrum: { frequencies: sp.frequencies, power: options.power?.(sp, k) ?? sp.power, segments, statistics },
    fit: options.fit?.(sp, k) ?? null,
  }));
}

/**
 * Scatter of a K-segment Welch average drawn from a seeded generator: 'log-normal' multiplies each bin
 * by exp(sigma g), sigma = 1/sqrt(K); 'gamma' by Gamma(K, 1/K), the average of K exponential periodogram
 * values (common practice). 'none' keeps the forward model's power.
 */
export type SyntheticNoise = { kind: 'none' } | { kind: 'log-normal' | 'gamma'; seed: number };

function scatterer(noise: SyntheticNoise, segments: number): ((p: number) => number) | null {
  if (noise.kind === 'none') return null;
  const rand = mulberry32(noise.seed);
  const sigma = 1 / Math.sqrt(segments);
  return noise.kind === 'gamma'
    ? (p) => (p * gammaDeviate(rand, segments)) / segments
    : (p) => p * Math.exp(sigma * gaussian(rand));
}

export interface SyntheticNetworkSpec {
  networkId: string;
  userId: string | null;
  sites: readonly HutSite[];
  components: readonly Component[];
  elevationM?: number | null;
  model: { name: string; cavity: CavityConfig };
  grid: GridInput;
  band: Band;
  /** Interval starts; the spectra are stored at each. */
  starts: Date[];
  /** The sources at each interval (by index), or none to store no spectra. */
  sources?: readonly ForwardSource[] | ((interval: number) => readonly ForwardSource[]);
  segments?: number;
  noise?: SyntheticNoise;
  run: Pick<RunConfig, 'name' | 'regions' | 'starts' | 'seed'> & { scaleCovariance: boolean };
}

export interface SyntheticNetwork {
  stations: Station[];
  model: ModelRow;
  grid: GridRow;
  starts: Date[];
  config: RunConfig;
}

/** Stores the network's stations, model, grid and spectra (12 intervals per write) and gives the run's configuration. */
export async function seedSyntheticNetwork(spec: SyntheticNetworkSpec): Promise<SyntheticNetwork> {
  const { networkId, userId, components, band, starts } = spec;
  const stations: Station[] = [];
  for (const site of spec.sites) stations.push(await createStation(networkId, hutInput(site, components, spec.elevationM)));
  const model = await saveModel(networkId, userId, { name: spec.model.name, notes: '', config: spec.model.cavity });
  const grid = await saveGrid(networkId, userId, spec.grid);
  const segments = spec.segments ?? 100;
  const { sources } = spec;
  if (sources) {
    const scatter = scatterer(spec.noise ?? { kind: 'none' }, segments);
    const fixed = typeof sources === 'function' ? null : stationSpectra(stations, components, spec.model.cavity, band, sources);
    for (let i0 = 0; i0 < starts.length; i0 += 12) {
      const rows = starts.slice(i0, i0 + 12).flatMap((t, j) => {
        const spectra =
          fixed ??
          stationSpectra(stations, components, spec.model.cavity, band, (sources as (i: number) => ForwardSource[])(i0 + j));
        return syntheticRows(networkId, stations, spectra, t, segments, {
          power: scatter ? (sp) => sp.power.map(scatter) : undefined,
        });
      });
      await saveIntervals(rows);
    }
  }
  const config: RunConfig = {
    name: spec.run.name,
    modelId: model.id,
    gridId: grid.id,
    data: {
      stationIds: stations.map((s) => s.id),
      components: [...components],
      from: starts[0].toISOString(),
      to: starts.at(-1)!.toISOString(),
      includeFlagged: false,
    },
    observables: { kind: 'spectrum', minHz: band.minHz, maxHz: band.maxHz, every: 1 },
    regions: spec.run.regions,
    damping: { initialLambda: 1e-2, maxIterations: 200, scaleCovariance: spec.run.scaleCovariance },
    starts: spec.run.starts,
    seed: spec.run.seed,
  };
  return { stations, model, grid, starts, config };
}
