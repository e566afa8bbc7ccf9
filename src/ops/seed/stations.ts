/**
 * Demo stations seeder: eight invented stations of the demo network spread
 * over the globe, and one UTC day of synthetic 10-minute intervals made with
 * the engine's forward model from an invented daily cycle of three regional
 * thunderstorm centres, with log-normal noise, stored with their mode fits.
 * Idempotent: stations are matched by code, a station whose demo day is
 * complete is left alone. Places and names are made up.
 */
import { createStation, getStationByCode, type StationInput } from '@/db/repo/stations';
import { listIntervals, saveIntervals, type IntervalResultInput } from '@/db/repo/intervals';
import { DEMO_BAND, DEMO_SEGMENTS, syntheticDay } from '@/src/data/synthetic-day';
import { demoNetworkId } from './accounts';
import { logNormalStatistics } from '@/src/data/spectrum-statistics';

/** The UTC day the demo data covers. */
export const DEMO_DAY = '2026-03-14';

type Demo = Omit<StationInput, 'components' | 'notes' | 'status' | 'sampleRateHz' | 'interferenceLines'> & {
  components: StationInput['components'][number]['component'][];
  lines?: StationInput['interferenceLines'];
};

const coil = 2.5e11; // invented induction-coil sensitivity, counts per tesla
const plate = 4.0e3; // invented electric-antenna sensitivity, counts per V/m

export const DEMO_STATIONS: Demo[] = [
  { code: 'ARV', name: 'Arvel Fen', latitude: 61.21, longitude: 24.73, elevationM: 96, mainsHz: 50, components: ['Bns', 'Bew'] },
  {
    code: 'BRQ',
    name: 'Brisquet Plateau',
    latitude: 39.42,
    longitude: -105.88,
    elevationM: 2790,
    mainsHz: 60,
    components: ['Ez', 'Bns', 'Bew'],
  },
  {
    code: 'CDL',
    name: 'Cordelin Sound',
    latitude: -33.58,
    longitude: 147.21,
    elevationM: 410,
    mainsHz: 50,
    components: ['Bns', 'Bew'],
  },
  {
    code: 'DNM',
    name: 'Dunvarrel Saddle',
    latitude: -23.12,
    longitude: -67.44,
    elevationM: 3960,
    mainsHz: 50,
    components: ['Ez', 'Bns', 'Bew'],
  },
  {
    code: 'EHK',
    name: 'Ehkari Terrace',
    latitude: 35.87,
    longitude: 138.92,
    elevationM: 1320,
    mainsHz: 60,
    components: ['Bns', 'Bew'],
  },
  {
    code: 'FLV',
    name: 'Falvorn Skerry',
    latitude: 64.71,
    longitude: -18.05,
    elevationM: 40,
    mainsHz: 50,
    components: ['Ez', 'Bns', 'Bew'],
    lines: [{ frequencyHz: 16.7, label: 'railway supply on the mainland' }],
  },
  {
    code: 'GSW',
    name: 'Gessvarin Rift',
    latitude: -1.31,
    longitude: 36.42,
    elevationM: 1850,
    mainsHz: 50,
    components: ['Bns', 'Bew'],
  },
  {
    code: 'HLC',
    name: 'Halcyon Shelf',
    latitude: -71.38,
    longitude: 12.24,
    elevationM: 120,
    mainsHz: 60,
    components: ['Bns', 'Bew'],
    lines: [{ frequencyHz: 11.3, label: 'camp generator subharmonic' }],
  },
];

/** A demo station as registered: invented place, 200 Hz, raw counts with a flat gain. */
export function demoStationInput(d: Demo): StationInput {
  return {
    code: d.code,
    name: d.name,
    latitude: d.latitude,
    longitude: d.longitude,
    elevationM: d.elevationM,
    mainsHz: d.mainsHz,
    sampleRateHz: 200,
    status: 'operating',
    interferenceLines: d.lines ?? [],
    notes: 'Demo station (invented place and data).',
    components: d.components.map((component) => ({
      component,
      calibration: { kind: 'gain' as const, gain: component === 'Ez' ? plate : coil },
    })),
  };
}

export async function seedDemoStations(networkId: string): Promise<{ created: number; intervals: number }> {
  const dayStart = Date.parse(`${DEMO_DAY}T00:00:00Z`);
  const stations = [];
  let created = 0;
  for (const d of DEMO_STATIONS) {
    let s = await getStationByCode(networkId, d.code);
    if (!s) {
      s = await createStation(networkId, demoStationInput(d));
      created++;
    }
    stations.push(s);
  }
  const have = await listIntervals({
    networkId,
    from: new Date(dayStart),
    to: new Date(dayStart + 86_400_000),
    includeFlagged: true,
  });
  const count = new Map<string, number>();
  for (const r of have) count.set(r.stationId, (count.get(r.stationId) ?? 0) + 1);
  const todo = stations.filter((s) => (count.get(s.id) ?? 0) < 144 * s.components.length);
  if (!todo.length) return { created, intervals: 0 };
  const day = syntheticDay(
    todo.map((s) => ({
      id: s.id,
      code: s.code,
      lat: s.latitude,
      lon: s.longitude,
      components: s.components.map((c) => c.component),
    })),
    dayStart,
    20260314,
  );
  const rows: IntervalResultInput[] = day.map((iv) => ({
    networkId,
    stationId: iv.stationId,
    component: iv.component,
    startsAt: iv.startsAt,
    durationS: 600,
    origin: 'synthetic',
    uploadId: null,
    rejectedShare: 0,
    qualityFlags: iv.flags,
    // The synthetic day's scatter: independent log-normal, sigma 1/sqrt(K) per bin (synthetic-day.ts).
    spectrum: {
      frequencies: iv.frequencies,
      power: iv.power,
      segments: DEMO_SEGMENTS,
      statistics: logNormalStatistics(1 / Math.sqrt(DEMO_SEGMENTS)),
    },
    fit: iv.fit,
  }));
  await saveIntervals(rows);
  return { created, intervals: rows.length };
}

export async function seed(): Promise<void> {
  await seedDemoStations(await demoNetworkId());
}

export { DEMO_BAND };
