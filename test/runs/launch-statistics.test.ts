/**
 * A run whose stored spectra lack statistics, or carry contradictory or too few ones, is refused at launch
 * with an error naming the series and the field, and nothing is stored; spectra with Welch statistics reach
 * the inverter with them (sigma from K_eff, src/data/spectrum-statistics.ts).
 */
import { afterAll, beforeEach, describe, expect, it } from 'vitest';
import { sql } from 'drizzle-orm';
import { closeQueueAndDatabase, resetDatabase } from '@/test/helpers/db';
import { getDb } from '@/db/client';
import { listRuns } from '@/db/repo/runs';
import { checkLaunch, launchRun } from '@/src/runs/launch';
import { loadSpectrumObservations } from '@/src/runs/observations';
import { AppError } from '@/src/server/errors';
import { makeRunWorld } from './world';

async function setStatistics(stationCode: string, component: string, statistics: unknown) {
  await getDb().execute(sql`
    update interval_spectra s set statistics = ${statistics === null ? null : JSON.stringify(statistics)}::jsonb
    from intervals i join stations st on st.id = i.station_id
    where i.id = s.interval_id and st.code = ${stationCode} and i.component = ${component}`);
}

describe('run launch and stored spectrum statistics', () => {
  beforeEach(resetDatabase);
  afterAll(() => closeQueueAndDatabase());

  it('refuses spectra without statistics, naming the series and field, and stores no run', async () => {
    const w = await makeRunWorld(2);
    await setStatistics('QX2', 'Bns', null);
    const { problems, preview } = await checkLaunch(w.networkId, w.config);
    expect(preview).toBeNull();
    expect(problems).toHaveLength(1);
    expect(problems[0].field).toBe('data');
    expect(problems[0].message).toMatch(/2 stored spectra cannot be used/);
    expect(problems[0].message).toMatch(/QX2 Bns 2031-05-12 06:00 UT: statistics: none recorded/);
    const err = await launchRun(w.networkId, w.userId, w.config).catch((e: unknown) => e);
    expect(err).toBeInstanceOf(AppError);
    expect((err as AppError).status).toBe(400);
    expect(await listRuns(w.networkId)).toHaveLength(0);
  });

  it('refuses contradictory and too few Welch statistics, naming the field', async () => {
    const w = await makeRunWorld(1);
    const hann = { window: 'hann', overlap: 0.5 };
    await setStatistics('QX1', 'Ez', { basis: 'measured', welch: { ...hann, segments: 20, effectiveAverages: 30 } });
    await setStatistics('QX3', 'Bew', { basis: 'measured', welch: { ...hann, segments: 3, effectiveAverages: 2.9 } });
    const { problems } = await checkLaunch(w.networkId, w.config);
    expect(problems[0].message).toMatch(/QX1 Ez .* statistics\.welch\.effectiveAverages: 30 exceeds the 20 segments/);
    expect(problems[0].message).toMatch(/QX3 Bew .* statistics\.welch\.segments: at least 4/);
    expect(await listRuns(w.networkId)).toHaveLength(0);
  });

  it('hands Welch statistics to the inverter with the sigma they imply', async () => {
    const w = await makeRunWorld(1);
    const welch = { segments: 119, window: 'hann', overlap: 0.5, effectiveAverages: 115.8 };
    await setStatistics('QX1', 'Ez', { basis: 'measured', welch });
    const observed = await loadSpectrumObservations(w.networkId, w.config, w.starts[0]);
    const qx1 = observed.find((o) => o.station === 'QX1' && o.component === 'Ez')!;
    expect(qx1.welch).toEqual(welch);
    // sigma of ln P = sqrt(trigamma(K_eff)) ~ sqrt(1/K + 1/(2K^2)) (asymptotic series, common practice)
    expect(qx1.sigmaLog).toBeCloseTo(Math.sqrt(1 / 115.8 + 1 / (2 * 115.8 ** 2)), 5);
    const qx2 = observed.find((o) => o.station === 'QX2')!;
    expect(qx2.welch).toBeUndefined();
    expect(qx2.sigmaLog).toBeCloseTo(0.1, 12);
    expect((await checkLaunch(w.networkId, w.config)).problems).toEqual([]);
  });
});
