/**
 * The migration that gives spectra stored before statistics were kept their statistics, each with its basis:
 * synthetic spectra their stated log-normal sigma, spectra of samples K_eff from the stored segment count
 * taken as contiguous (Welch 1967: K / (1 + 2 (1 - 1/K) / 36) for Hann at 50 % overlap), empty ones none.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { readFileSync, readdirSync } from 'node:fs';
import { sql } from 'drizzle-orm';
import { closeDatabase, resetDatabase } from '@/test/helpers/db';
import { getDb } from '@/db/client';
import { getIntervalSpectra, saveIntervals } from '@/db/repo/intervals';
import { hannEffectiveAverages } from '@/src/engine/stats/welch-statistics';
import { makeRunWorld } from '@/test/runs/world';

const FILL = readdirSync('migrations').find((f) => f.endsWith('_interval-statistics-fill.sql'))!;

describe('interval statistics fill (migration)', () => {
  beforeAll(resetDatabase);
  afterAll(closeDatabase);

  it('fills each old spectrum by its kind and leaves empty ones without', async () => {
    const w = await makeRunWorld(1);
    const base = {
      networkId: w.networkId,
      component: 'Ez' as const,
      durationS: 600,
      uploadId: null,
      rejectedShare: 0,
      qualityFlags: [],
      fit: null,
    };
    const t = new Date(Date.UTC(2031, 4, 13));
    await saveIntervals([
      {
        ...base,
        stationId: w.stations[0].id,
        startsAt: t,
        origin: 'synthetic',
        spectrum: { frequencies: [8], power: [1e-10], segments: 100 },
      },
      {
        ...base,
        stationId: w.stations[1].id,
        startsAt: t,
        origin: 'push',
        spectrum: { frequencies: [8], power: [1e-10], segments: 37 },
      },
      {
        ...base,
        stationId: w.stations[2].id,
        startsAt: t,
        origin: 'push',
        spectrum: { frequencies: [], power: [], segments: 0 },
      },
    ]);
    for (const statement of readFileSync(`migrations/${FILL}`, 'utf8').split('--> statement-breakpoint'))
      await getDb().execute(sql.raw(statement));
    const rows = await getIntervalSpectra({ networkId: w.networkId, from: t });
    const by = new Map(rows.map((r) => [r.stationCode, r.statistics]));
    expect(by.get('QX1')).toEqual({ basis: 'log-normal', sigmaLog: 0.1 });
    const push = by.get('QX2') as { basis: string; welch: { segments: number; effectiveAverages: number } };
    expect(push.basis).toBe('from-count');
    expect(push.welch.segments).toBe(37);
    expect(push.welch.effectiveAverages).toBeCloseTo(hannEffectiveAverages(37, 0.5), 10);
    expect(by.get('QX3')).toBeNull();
  });
});
