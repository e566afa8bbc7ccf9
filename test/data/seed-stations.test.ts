/**
 * Demo stations seeder: stations spread over the globe, one full synthetic
 * day per component, idempotent, and the stored spectra scatter around the
 * engine's forward model by the log-normal noise of a Welch average
 * (relative scatter 1/sqrt(K); Welch 1967).
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { closeDatabase, resetDatabase } from '@/test/helpers/db';
import { listStations } from '@/db/repo/stations';
import { getIntervalSpectra, listIntervals } from '@/db/repo/intervals';
import { predictSpectra } from '@/src/engine/forward/predict';
import { DEMO_DAY, DEMO_STATIONS, seedDemoStations } from '@/src/ops/seed/stations';
import { DEMO_BAND, DEMO_CENTRES, DEMO_SEGMENTS, centreIntensity } from '@/src/data/synthetic-day';
import { makeWorld } from './world';

let networkId = '';
let first: Awaited<ReturnType<typeof seedDemoStations>>;
beforeAll(async () => {
  await resetDatabase();
  networkId = (await makeWorld()).networkId;
  const t0 = Date.now();
  first = await seedDemoStations(networkId);
  console.log(`[measure] demo stations seeded in ${Date.now() - t0} ms (${first.intervals} intervals)`);
});
afterAll(closeDatabase);

describe('demo stations seeder', () => {
  it('creates the stations and a day of intervals once', async () => {
    const nComponents = DEMO_STATIONS.reduce((s, d) => s + d.components.length, 0);
    expect(first).toEqual({ created: DEMO_STATIONS.length, intervals: 144 * nComponents });
    const stations = await listStations(networkId);
    expect(stations.length).toBeGreaterThanOrEqual(6);
    expect(stations.length).toBeLessThanOrEqual(12);
    // spread over the globe: both hemispheres, and more than 180 degrees of longitude
    expect(stations.some((s) => s.latitude > 20) && stations.some((s) => s.latitude < -20)).toBe(true);
    const lons = stations.map((s) => s.longitude);
    expect(Math.max(...lons) - Math.min(...lons)).toBeGreaterThan(180);
    expect(await seedDemoStations(networkId)).toEqual({ created: 0, intervals: 0 });
    const rows = await listIntervals({ networkId, includeFlagged: true });
    expect(rows).toHaveLength(144 * nComponents);
    expect(rows.filter((r) => r.fit).length / rows.length).toBeGreaterThan(0.9);
    // the demo day's spectra are made without interference lines, so every fit records that it left nothing out
    expect(rows.filter((r) => r.fit).every((r) => Array.isArray(r.fit!.excluded) && r.fit!.excluded.length === 0)).toBe(true);
  });

  it('stores spectra that scatter around the forward model by 1/sqrt(K) in ln(power)', async () => {
    const station = (await listStations(networkId)).find((s) => s.code === 'DNM')!;
    const startsAt = new Date(`${DEMO_DAY}T12:00:00Z`);
    const [obs] = await getIntervalSpectra({
      networkId,
      stationIds: [station.id],
      components: ['Ez'],
      from: startsAt,
      to: new Date(startsAt.getTime() + 600_000),
    });
    const hour = 12 + 5 / 60;
    const [pred] = predictSpectra({
      cavity: { model: 'ishaq-jones', earthRadiusKm: 6371, heightKm: 60 },
      band: DEMO_BAND,
      stations: [{ code: 'DNM', lat: station.latitude, lon: station.longitude, components: ['Ez'] }],
      sources: DEMO_CENTRES.map((c) => ({ lat: c.lat, lon: c.lon, spreadDeg: c.spreadDeg, intensity: centreIntensity(c, hour) })),
    });
    const r = obs.power.map((p, i) => Math.log(p / pred.power[i]));
    const m = r.reduce((s, v) => s + v, 0) / r.length;
    const sd = Math.sqrt(r.reduce((s, v) => s + (v - m) ** 2, 0) / (r.length - 1));
    expect(Math.abs(m)).toBeLessThan(4 / Math.sqrt(DEMO_SEGMENTS * r.length));
    expect(sd * Math.sqrt(DEMO_SEGMENTS)).toBeGreaterThan(0.85);
    expect(sd * Math.sqrt(DEMO_SEGMENTS)).toBeLessThan(1.15);
  });
});
