/**
 * Loading a run's observations several intervals per query gives each interval
 * exactly what loading it alone gives (same series, same order), including an
 * interval with a flagged series left out and a time with no data at all.
 * Mode runs fit predicted spectra leaving out what each stored fit recorded
 * it left out, and assume the station's lines only for fits that did not.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { closeDatabase, resetDatabase } from '@/test/helpers/db';
import { listIntervals, setIntervalFlag } from '@/db/repo/intervals';
import { updateStation } from '@/db/repo/stations';
import { bandFrequencies } from '@/src/engine/band';
import { fitModes } from '@/src/engine/modes/fit-modes';
import { modeSeriesSetup } from '@/src/engine/inverse/predicted-modes';
import { listedLines, suppressLines } from '@/src/engine/signal/line-suppression';
import { storedFit } from '@/src/data/interval-processing';
import type { RunConfig } from '@/src/runs/config';
import {
  assumedExclusionSeries,
  intervalLoader,
  loadModeObservations,
  loadSpectrumObservations,
  loadSpectrumObservationsOf,
  MODE_BAND,
} from '@/src/runs/observations';
import { makeRunWorld, SEGMENTS, storeSpectra, truthSpectra } from './world';

describe('observations of several intervals at once', () => {
  beforeAll(resetDatabase);
  afterAll(closeDatabase);

  it('match interval-by-interval loading, bucket by bucket', async () => {
    const w = await makeRunWorld(5);
    const rows = await listIntervals({ networkId: w.networkId, from: w.starts[2], to: new Date(w.starts[2].getTime() + 1) });
    expect(
      await setIntervalFlag(w.networkId, rows[0].id, { reason: 'test: cattle at the electrode', userId: w.userId }),
    ).not.toBeNull();
    const empty = new Date(w.starts[4].getTime() + 3_600_000);
    const times = [...w.starts, empty];
    const batch = await loadSpectrumObservationsOf(w.networkId, w.config, times);
    for (const t of times) expect(batch.get(t.getTime())).toEqual(await loadSpectrumObservations(w.networkId, w.config, t));
    expect(times.map((t) => batch.get(t.getTime())!.length)).toEqual([9, 9, 8, 9, 9, 0]);

    const load = intervalLoader(w.networkId, w.config, times, 2);
    for (const t of times) expect((await load(t)).observed).toEqual(await loadSpectrumObservations(w.networkId, w.config, t));
  });
});

describe('exclusions of stored mode fits in a mode run', () => {
  beforeAll(resetDatabase);
  afterAll(closeDatabase);

  // The notch rule of line suppression, |f - line| <= half-width, worked by hand on the 0.1 Hz grid: a line at
  // 16.65 Hz with the default 0.3 Hz half-width covers 16.4–16.9 Hz; one at 11.05 Hz covers 10.8–11.3 Hz.
  it("fit the predicted spectrum with the stored exclusions, and with the station's lines for older fits", async () => {
    const w = await makeRunWorld(1);
    const t = w.starts[0];
    const grid = bandFrequencies(MODE_BAND);
    const spectra = truthSpectra(w, MODE_BAND, ['Ez']);
    // QX1: a time-series fit that left out 16.4–16.9 Hz; its station has since listed 11.05 Hz as well.
    // QX2: a fit stored before exclusions were recorded. QX3: a spectra-file fit that left out nothing.
    const line = listedLines([{ frequencyHz: 16.65 }]);
    const fits = spectra.map((sp) => {
      const exclude = sp.station === 'QX3' ? undefined : suppressLines(sp.frequencies, sp.power, line).suppressed;
      const f = storedFit(fitModes(sp.frequencies, sp.power, { modes: 5, averages: SEGMENTS, exclude }));
      if (sp.station === 'QX2') delete f.excluded;
      return f;
    });
    await storeSpectra(w, spectra, t, { fit: (_, k) => fits[k] });
    const lines = {
      QX1: [
        { frequencyHz: 16.65, label: 'rail' },
        { frequencyHz: 11.05, label: 'new pump' },
      ],
      QX2: [{ frequencyHz: 16.65, label: 'rail' }],
      QX3: [{ frequencyHz: 16.65, label: 'rail' }],
    };
    for (const s of w.stations) {
      const { id: _id, networkId: _n, createdAt: _c, updatedAt: _u, ...input } = s;
      expect(
        await updateStation(w.networkId, s.id, { ...input, interferenceLines: lines[s.code as keyof typeof lines] }),
      ).not.toBeNull();
    }
    const config: RunConfig = {
      ...w.config,
      name: 'Modes',
      observables: { kind: 'modes', modes: 3 },
      data: { ...w.config.data, components: ['Ez'] },
    };
    const obs = await loadModeObservations(w.networkId, config, t);
    const by = Object.fromEntries(obs.map((o) => [o.station, o]));
    expect(Object.keys(by).sort()).toEqual(['QX1', 'QX2', 'QX3']);
    const binsOf = (code: string) => Array.from(modeSeriesSetup(by[code], grid, code).bins, (i) => Math.round(grid[i] * 10) / 10);
    const band = (code: string) =>
      Array.from(grid, (f) => Math.round(f * 10) / 10).filter(
        (f) => f >= by[code].fit!.minHz! - 1e-9 && f <= by[code].fit!.maxHz! + 1e-9,
      );
    const notch = [16.4, 16.5, 16.6, 16.7, 16.8, 16.9];
    const pump = [10.8, 10.9, 11, 11.1, 11.2, 11.3];

    // recorded: exactly the stored range, not the line listed since
    expect(by.QX1.fit!.exclusionsAssumed).toBeUndefined();
    expect(by.QX1.fit!.excludeLines).toBeUndefined();
    expect(binsOf('QX1')).toEqual(band('QX1').filter((f) => !notch.includes(f)));
    // recorded as nothing: every bin of the band, although the station lists 16.65 Hz
    expect(by.QX3.fit!.excludeRanges).toEqual([]);
    expect(binsOf('QX3')).toEqual(band('QX3'));
    // not recorded: the station's lines as they are now, marked as assumed
    expect(by.QX2.fit!.exclusionsAssumed).toBe(true);
    expect(binsOf('QX2')).toEqual(band('QX2').filter((f) => !notch.includes(f)));
    expect(assumedExclusionSeries(obs)).toHaveLength(1);
    expect(assumedExclusionSeries(obs)[0]).toMatch(/^QX2 (Ez|Bns|Bew)$/);
    // the pump line would have been assumed for QX1 too, had its fit not recorded what it left out
    expect(band('QX1').filter((f) => pump.includes(f))).toEqual(pump);
  });
});
