/**
 * A synthetic day of station spectra for the demo: the engine's forward model
 * driven by an invented daily cycle of three regional thunderstorm centres,
 * multiplied by log-normal noise of the size a Welch average of K segments
 * has (relative scatter 1/sqrt(K) per bin; Welch 1967), then fitted with the
 * Lorentzian mode fit. Seeded, so the same day comes out every time.
 */
import { createForwardModel } from '@/src/engine/forward/forward-model';
import { asCavity } from '@/src/engine/forward/predict';
import { fitModes } from '@/src/engine/modes/fit-modes';
import type { ForwardSource } from '@/src/engine/sources/types';
import type { Band } from '@/src/engine/band';
import { gaussian, mulberry32 } from '@/src/engine/random';
import type { Component } from '@/src/engine/components';
import type { IntervalFit } from '@/db/repo/intervals';
import { storedFit } from './interval-processing';

export interface SyntheticStation {
  id: string;
  code: string;
  lat: number;
  lon: number;
  components: Component[];
}

/** An invented regional centre: where it sits and when in the UTC day it peaks. */
export interface ActivityCentre {
  name: string;
  lat: number;
  lon: number;
  spreadDeg: number;
  baseline: number;
  peak: number;
  peakHourUtc: number;
  widthHours: number;
}

export const DEMO_CENTRES: ActivityCentre[] = [
  { name: 'west', lat: -6, lon: -58, spreadDeg: 10, baseline: 2.0e4, peak: 9.0e4, peakHourUtc: 20, widthHours: 3 },
  { name: 'middle', lat: 2, lon: 22, spreadDeg: 10, baseline: 2.5e4, peak: 1.1e5, peakHourUtc: 15, widthHours: 2.5 },
  { name: 'east', lat: 4, lon: 112, spreadDeg: 12, baseline: 1.5e4, peak: 7.0e4, peakHourUtc: 8, widthHours: 3 },
];

export const DEMO_BAND: Band = { minHz: 3, maxHz: 30, stepHz: 0.1 };
/** Segments of a 10-minute Welch average with 10-s Hann segments and 50 % overlap. */
export const DEMO_SEGMENTS = 119;

/** Intensity of a centre at a time of day (C^2 km^2/s): a Gaussian bump on a baseline, wrapped over 24 h. */
export function centreIntensity(c: ActivityCentre, hourUtc: number): number {
  let d = Math.abs(hourUtc - c.peakHourUtc) % 24;
  if (d > 12) d = 24 - d;
  return c.baseline + c.peak * Math.exp(-0.5 * (d / c.widthHours) ** 2);
}

export interface SyntheticInterval {
  stationId: string;
  component: Component;
  startsAt: Date;
  frequencies: number[];
  power: number[];
  fit: IntervalFit | null;
  flags: string[];
}

/** Every 10-minute interval of one UTC day (dayStartMs at 00:00Z) for all stations and components. */
export function syntheticDay(stations: SyntheticStation[], dayStartMs: number, seed = 1): SyntheticInterval[] {
  const model = createForwardModel(
    asCavity({ model: 'ishaq-jones', earthRadiusKm: 6371, heightKm: 60 }),
    DEMO_BAND,
    stations.map((s) => ({ code: s.code, lat: s.lat, lon: s.lon, components: s.components })),
  );
  const out = model.createOutput();
  const freqs = Array.from(model.freqs);
  const rand = mulberry32(seed);
  const normal = () => gaussian(rand);
  const sigma = 1 / Math.sqrt(DEMO_SEGMENTS);
  const result: SyntheticInterval[] = [];
  for (let k = 0; k < 144; k++) {
    const hour = (k + 0.5) / 6;
    const sources: ForwardSource[] = DEMO_CENTRES.map((c) => ({
      name: c.name,
      lat: c.lat,
      lon: c.lon,
      spreadDeg: c.spreadDeg,
      intensity: centreIntensity(c, hour),
    }));
    model.evaluate(sources, out);
    stations.forEach((st, s) => {
      for (const component of st.components) {
        const clean = component === 'Ez' ? out[s].ez : component === 'Bns' ? out[s].bns : out[s].bew;
        const power = Array.from(clean, (p) => p * Math.exp(sigma * normal()));
        let fit: IntervalFit | null = null;
        let flags: string[] = [];
        try {
          const f = fitModes(freqs, power, { modes: 3, minHz: 4, maxHz: 24, averages: DEMO_SEGMENTS });
          fit = storedFit(f);
          flags = [...f.flags];
        } catch {
          flags = ['fit-failed'];
        }
        result.push({
          stationId: st.id,
          component,
          startsAt: new Date(dayStartMs + k * 600_000),
          frequencies: freqs,
          power,
          fit,
          flags,
        });
      }
    });
  }
  return result;
}
