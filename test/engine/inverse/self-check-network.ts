/**
 * The invented network of the statistical self-checks: three stations, three
 * fixed regions of known intensity, a linear cavity, 5–24 Hz, and raw series
 * of 640 s at 51.2 Hz (10 s segments, 127 Welch segments) drawn from the
 * project's forward model (studies/welch-observations.ts). Nothing here is a
 * real place.
 */
import { predictSpectra } from '@/src/engine/forward';
import type { RegionUnknown } from '@/src/engine/inverse/types';
import type { Minimum } from '@/src/engine/inverse/types';

export const CAVITY = { model: 'linear' as const, earthRadiusKm: 6371, heightKm: 60 };
export const BAND = { minHz: 5, maxHz: 24, stepHz: 0.1 };
export const STATIONS = [
  { code: 'KV1', lat: 61.5, lon: 25.2, components: ['Ez', 'Bns'] as ('Ez' | 'Bns' | 'Bew')[] },
  { code: 'KV2', lat: -33.1, lon: 147.6, components: ['Bew', 'Bns'] as ('Ez' | 'Bns' | 'Bew')[] },
  { code: 'KV3', lat: 35.4, lon: -105.9, components: ['Ez'] as ('Ez' | 'Bns' | 'Bew')[] },
];
export const SITES = STATIONS.map((s) => ({ code: s.code, lat: s.lat, lon: s.lon }));
export const TRUTH = [
  { name: 'A', lat: 5, lon: 20, intensity: 4e4 },
  { name: 'B', lat: -5, lon: -60, intensity: 3e4 },
  { name: 'C', lat: 10, lon: 110, intensity: 2e4 },
];
export const RECORDING = { sampleRateHz: 51.2, samples: 32768, segmentLength: 512 };
export const FIXED_UNKNOWNS: RegionUnknown[] = TRUTH.map((t) => ({
  name: t.name,
  intensity: { min: 1e2, max: 1e7 },
  lat: t.lat,
  lon: t.lon,
}));

export const trueSpectra = () => predictSpectra({ cavity: CAVITY, band: BAND, stations: STATIONS, sources: TRUTH });

/** Pulls (estimate - truth) / stdError of every region's intensity at a minimum. */
export function intensityPulls(best: Minimum): number[] {
  return TRUTH.map((t) => {
    const got = best.sources.find((s) => s.name === t.name)!;
    return (got.intensity - t.intensity) / best.stdErrors[t.name].intensity!;
  });
}

export { meanAndSpread } from '@/src/engine/stats/mean-spread';
