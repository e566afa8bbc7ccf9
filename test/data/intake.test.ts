/**
 * Upload intake and processing against a throwaway PostgreSQL: accepted files
 * are stored once (checksum) and processed whole; rejected files store
 * nothing and name file, line and field; failed processing can be retried.
 */
import { createHash } from 'node:crypto';
import { afterAll, afterEach, beforeAll, describe, expect, it } from 'vitest';
import { closeDatabase, resetDatabase } from '@/test/helpers/db';
import { stopBoss } from '@/db/jobs';
import { listUploads, readUploadBytes, getUpload } from '@/db/repo/uploads';
import { getIntervalSpectra, listIntervals } from '@/db/repo/intervals';
import { updateStation } from '@/db/repo/stations';
import { receiveUpload, retryUpload } from '@/src/data/intake';
import { processUpload } from '@/src/data/process-upload';
import { inExcludedRange } from '@/src/engine/modes/excluded-ranges';
import { hannWelchBinCorrelation } from '@/src/engine/stats/welch-bin-correlation';
import { makeWorld, stationInput } from './world';
import { bodyOf, seriesCsv, TEST_MODES, type SeriesSpec } from './series-maker';

beforeAll(resetDatabase);
afterAll(async () => {
  await stopBoss(5000);
  await closeDatabase();
});
afterEach(() => {
  delete process.env.UPLOAD_MAX_MB;
});

const FS = 100;
const station100 = { sampleRateHz: FS };
const spec = (over: Partial<SeriesSpec> = {}): SeriesSpec => ({
  station: 'TST1',
  fs: FS,
  startUtc: '2026-03-14T00:00:00Z',
  seconds: 600,
  components: { Ez: { kind: 'white', sigma: 1, unit: 'mV/m' }, Bns: { kind: 'white', sigma: 2, unit: 'counts' } },
  ...over,
});

async function upload(w: Awaited<ReturnType<typeof makeWorld>>, text: string, fileName = 'rec.csv') {
  return receiveUpload({
    station: w.station,
    userId: w.userId,
    fileName,
    body: bodyOf(text),
    contentLength: Buffer.byteLength(text),
  });
}

const mean = (a: number[]) => a.reduce((s, v) => s + v, 0) / a.length;

describe('upload intake and processing', () => {
  it('stores a series file once, processes it, and gets the white-noise PSD level 2 sigma^2 / fs', async () => {
    const w = await makeWorld(station100);
    const text = seriesCsv(spec());
    const first = await upload(w, text);
    expect(first.duplicate).toBe(false);
    expect(first.upload.format).toBe('series-csv');
    expect(first.upload.sha256).toBe(createHash('sha256').update(text).digest('hex'));
    expect(first.upload.sizeBytes).toBe(Buffer.byteLength(text));
    const parts: Buffer[] = [];
    for await (const c of readUploadBytes(first.upload.id)) parts.push(c);
    expect(Buffer.concat(parts).toString()).toBe(text);

    const again = await upload(w, text, 'same-file-other-name.csv');
    expect(again).toMatchObject({ duplicate: true, upload: { id: first.upload.id } });
    expect(await listUploads(w.networkId)).toHaveLength(1);

    expect(await processUpload(first.upload.id)).toBe('done');
    const up = await getUpload(w.networkId, first.upload.id);
    expect(up).toMatchObject({ state: 'done', progress: 1, intervalCount: 2 });
    const spectra = await getIntervalSpectra({ networkId: w.networkId });
    expect(spectra.map((s) => s.component).sort()).toEqual(['Bns', 'Ez']);
    const ez = spectra.find((s) => s.component === 'Ez')!;
    // Ez in mV/m, sigma 1 mV/m = 1e-3 V/m: one-sided PSD 2 sigma^2 / fs (Parseval)
    expect(mean(ez.power) / ((2 * 1e-6) / FS)).toBeGreaterThan(0.97);
    expect(mean(ez.power) / ((2 * 1e-6) / FS)).toBeLessThan(1.03);
    expect(ez.segments).toBeGreaterThan(100);
    const bns = spectra.find((s) => s.component === 'Bns')!;
    // Bns in counts with the station's flat gain 1e9 counts per tesla: P_T = P_counts / gain^2
    expect(mean(bns.power) / ((2 * 4) / FS / 1e18)).toBeGreaterThan(0.97);
    expect(mean(bns.power) / ((2 * 4) / FS / 1e18)).toBeLessThan(1.03);
    // processing again (as after a retry) keeps one row per station, component and start
    expect((await listIntervals({ networkId: w.networkId })).length).toBe(2);
  });

  it('fits the modes of a resonant recording near their frequencies', async () => {
    const w = await makeWorld(station100);
    const text = seriesCsv(
      spec({ seconds: 1200, seed: 11, components: { Ez: { kind: 'modes', modes: TEST_MODES, floor: 0.3, unit: 'mV/m' } } }),
    );
    const { upload: u } = await upload(w, text);
    expect(await processUpload(u.id)).toBe('done');
    const rows = await listIntervals({ networkId: w.networkId });
    expect(rows.map((r) => r.startsAt.toISOString())).toEqual(['2026-03-14T00:00:00.000Z', '2026-03-14T00:10:00.000Z']);
    const spectra = await getIntervalSpectra({ networkId: w.networkId });
    for (const [i, r] of rows.entries()) {
      expect(r.fit).not.toBeNull();
      // stored with the band fitted and the scatter its errors assume: K_eff = K / (1 + 2 (1 - 1/K) rho^2),
      // rho = 1/6 for Hann at 50 % overlap (Welch 1967; Harris 1978, Table 1); the averaged bins are correlated
      // by the segments' own (2/3)^2 and (1/6)^2 (Harris 1978) raised by the overlapping neighbours, as the
      // Welch bin correlation computes it (checked against numpy in test/engine/stats/welch-statistics.test.ts)
      const k = spectra[i].segments;
      expect(r.fit!.band!.minHz).toBe(3);
      expect(r.fit!.band!.maxHz).toBeGreaterThan(r.fit!.modes.at(-1)!.frequency);
      expect(r.fit!.band!.maxHz).toBeLessThanOrEqual(spectra[i].frequencies.at(-1)!);
      expect(r.fit!.averages).toBeCloseTo(k / (1 + (2 * (1 - 1 / k)) / 36), 9);
      expect(r.fit!.binCorrelation).toEqual(hannWelchBinCorrelation(k, 0.5));
      expect(r.fit!.binCorrelation![0]).toBeGreaterThan(4 / 9);
      expect(r.fit!.binCorrelation![1]).toBeGreaterThan(1 / 36);
      // the generating Lorentzians are recovered within a few reported standard errors
      for (const [n, m] of TEST_MODES.slice(0, 2).entries()) {
        const got = r.fit!.modes[n];
        expect(Math.abs(got.frequency - m.f)).toBeLessThan(4 * got.errors.frequency + 0.02);
        expect(Math.abs(got.halfWidth - m.halfWidth)).toBeLessThan(4 * got.errors.halfWidth + 0.05);
      }
    }
  });

  it("stores what each fit left out: the station's lines for time series, nothing for a spectra file", async () => {
    // A listed line at 16.65 Hz with the default notch half-width of 0.3 Hz (src/engine/tolerances.ts) covers
    // the 0.1 Hz bins 16.4–16.9 Hz (|f - 16.65| <= 0.3, worked by hand; no bin on a notch edge). Mains at 50 Hz
    // lies above the fitted band of a 100 Hz recording (3 Hz to 3.5 Hz past the highest usual mode fitted).
    const w = await makeWorld({ ...station100, interferenceLines: [{ frequencyHz: 16.65, label: 'railway supply' }] });
    const series = await upload(
      w,
      seriesCsv(
        spec({ seconds: 600, seed: 21, components: { Ez: { kind: 'modes', modes: TEST_MODES, floor: 0.3, unit: 'mV/m' } } }),
      ),
    );
    expect(await processUpload(series.upload.id)).toBe('done');
    const freqs = Array.from({ length: 331 }, (_, i) => 3 + i * 0.1);
    const lor = (f: number) => 1 + TEST_MODES.reduce((a, m) => a + (10 * m.gain) / (1 + ((f - m.f) / m.halfWidth) ** 2), 0);
    const file =
      [
        '# cavitas-spectra 1',
        '# station: TST1',
        '# component: Ez',
        '# units: (mV/m)^2/Hz',
        '# interval-seconds: 600',
        'frequency-hz,2026-03-14T02:00:00Z',
        ...freqs.map((f) => `${f.toFixed(1)},${lor(f).toPrecision(6)}`),
      ].join('\n') + '\n';
    const spectra = await upload(w, file, 'spectra.csv');
    expect(await processUpload(spectra.upload.id)).toBe('done');

    const rows = await listIntervals({ networkId: w.networkId, components: ['Ez'] });
    const fromSeries = rows.find((r) => r.origin === 'upload' && r.uploadId === series.upload.id)!;
    const fromFile = rows.find((r) => r.uploadId === spectra.upload.id)!;
    expect(fromSeries.fit!.excluded).toHaveLength(1);
    expect(fromSeries.fit!.excluded![0].minHz).toBeCloseTo(16.4, 9);
    expect(fromSeries.fit!.excluded![0].maxHz).toBeCloseTo(16.9, 9);
    expect(fromFile.fit!.excluded).toEqual([]);
    // on the stored spectrum's own bins the range holds exactly those six
    const sp = (await getIntervalSpectra({ networkId: w.networkId, intervalIds: [fromSeries.id] }))[0];
    const left = sp.frequencies.filter((f) => inExcludedRange(f, fromSeries.fit!.excluded!));
    expect(left.map((f) => Math.round(f * 10) / 10)).toEqual([16.4, 16.5, 16.6, 16.7, 16.8, 16.9]);
  });

  it('marks processing failed with the reason and processes again after the station is fixed', async () => {
    const w = await makeWorld(station100);
    const { upload: u } = await upload(w, seriesCsv(spec({ seed: 3 })));
    // The Bns component is removed before the worker gets to the file.
    await updateStation(
      w.networkId,
      w.station.id,
      stationInput({ ...station100, components: [{ component: 'Ez', calibration: { kind: 'gain', gain: 1 } }] }),
    );
    expect(await processUpload(u.id)).toBe('failed');
    const failed = await getUpload(w.networkId, u.id);
    expect(failed?.state).toBe('failed');
    expect(failed?.error).toMatch(/no Bns component/);
    expect(await listIntervals({ networkId: w.networkId })).toHaveLength(0);
    await updateStation(w.networkId, w.station.id, stationInput(station100));
    expect((await retryUpload(w.networkId, u.id)).state).toBe('queued');
    await expect(retryUpload(w.networkId, u.id)).rejects.toMatchObject({ status: 409 });
    expect(await processUpload(u.id)).toBe('done');
    expect((await getUpload(w.networkId, u.id))?.attempts).toBe(2);
  });

  it('accepts the spectra CSV layout and the JSON series', async () => {
    const w = await makeWorld(station100);
    const freqs = Array.from({ length: 200 }, (_, i) => 3 + i * 0.1);
    const lor = (f: number) => 1 + TEST_MODES.reduce((s, m) => s + (10 * m.gain) / (1 + ((f - m.f) / m.halfWidth) ** 2), 0);
    const spectra =
      [
        '# cavitas-spectra 1',
        '# station: TST1',
        '# component: Bns',
        '# units: pT^2/Hz',
        '# interval-seconds: 600',
        'frequency-hz,2026-03-14T00:00:00Z,2026-03-14T00:10:00Z',
        ...freqs.map((f) => `${f.toFixed(1)},${lor(f).toPrecision(6)},${(1.1 * lor(f)).toPrecision(6)}`),
      ].join('\n') + '\n';
    const a = await upload(w, spectra, 'spectra.csv');
    expect(a.upload.format).toBe('spectra-csv');
    expect(await processUpload(a.upload.id)).toBe('done');
    const rows = await getIntervalSpectra({ networkId: w.networkId, components: ['Bns'] });
    expect(rows).toHaveLength(2);
    expect(rows[0].power[0] / (lor(3) * 1e-24)).toBeCloseTo(1, 5); // pT^2/Hz to T^2/Hz (file holds 6 digits)
    const fit = (await listIntervals({ networkId: w.networkId, components: ['Bns'] }))[0].fit!;
    expect(Math.abs(fit.modes[0].frequency - 7.8)).toBeLessThan(0.05); // noise-free Lorentzians
    // a file's spectrum is taken as 119 ten-second Hann segments at 50 % overlap (K_eff as in Welch 1967)
    expect(fit.averages).toBeCloseTo(119 / (1 + (2 * (118 / 119)) / 36), 9);
    expect(fit.band!.minHz).toBe(3);

    const samples = Array.from({ length: 600 * FS }, (_, i) => Math.sin(i * 0.7) + Math.cos(i * 1.3));
    const json = JSON.stringify({
      station: 'TST1',
      component: 'Ez',
      startUtc: '2026-03-14T01:00:00Z',
      sampleRateHz: FS,
      samples,
    });
    const b = await upload(w, json, 'one.json');
    expect(b.upload.format).toBe('series-json');
    expect(await processUpload(b.upload.id)).toBe('done');
    expect((await getUpload(w.networkId, b.upload.id))?.intervalCount).toBe(1);
  });
});

describe('rejected uploads store nothing and say why', () => {
  const cases: [string, () => string, RegExp, string][] = [
    ['not a station file', () => 'hello,world\n1,2\n', /line 1: not a Cavitas station file/, 'file'],
    ['unknown station code', () => seriesCsv(spec({ station: 'NOPE9', seconds: 1 })), /unknown station code "NOPE9"/, 'station'],
    [
      'component not installed',
      () => seriesCsv(spec({ seconds: 1, components: { Bew: { kind: 'white', sigma: 1, unit: 'pT' } } })),
      /no Bew component/,
      'Bew',
    ],
    [
      'station rate disagrees',
      () => seriesCsv(spec({ seconds: 1, fs: 50 })),
      /disagrees with station TST1's registered 100 Hz/,
      'sample-rate-hz',
    ],
    ['rows off the header rate', () => seriesCsv(spec({ seconds: 1, headerRate: 100, fs: 40 })), /line 8.*"seconds"/, 'seconds'],
    [
      'non-numeric cell',
      () => seriesCsv(spec({ seconds: 1 })).replace(/\n0\.05,[^,]+,/, '\n0.05,abc,'),
      /line 12, field "Ez".*"abc" is not a number/,
      'Ez',
    ],
    [
      'NaN cell',
      () => seriesCsv(spec({ seconds: 1 })).replace(/\n0\.05,[^,]+,/, '\n0.05,NaN,'),
      /line 12, field "Ez": NaN is not allowed/,
      'Ez',
    ],
    ['truncated file', () => seriesCsv(spec({ seconds: 1 })).slice(0, -12), /cut off/, 'file'],
    ['missing column', () => seriesCsv(spec({ seconds: 1 })).replace('seconds,Ez,Bns', 'seconds,Ez'), /units/, 'units'],
    // Sample dates outside the accepted window (SAMPLE_EARLIEST 1990-01-01, SAMPLE_AHEAD_HOURS 24 by default).
    [
      'dated in the year 1000',
      () => seriesCsv(spec({ startUtc: '1000-01-01T00:00:00Z', seconds: 20 })),
      /start-utc: 1000-01-01T00:00:00.000Z lies outside the accepted sample dates, from 1990-01-01/,
      'start-utc',
    ],
    [
      'dated in the year 2999',
      () => seriesCsv(spec({ startUtc: '2999-01-01T00:00:00Z', seconds: 20 })),
      /outside the accepted sample dates.*24 h past the server's clock/,
      'start-utc',
    ],
    // One Welch segment of 10 s at 100 Hz is 1000 samples; a second of data is 100.
    [
      'too short for one segment',
      () => seriesCsv(spec({ seconds: 1 })),
      /100 samples are too short.*one 10 s segment, 1000 samples at 100 Hz/,
      'file',
    ],
    [
      'out-of-order rows',
      () => seriesCsv(spec({ seconds: 1 })).replace(/\n0\.05,/, '\n0.03,'),
      /line 12.*out of order|overlap/,
      'seconds',
    ],
  ];
  for (const [name, make, message, field] of cases) {
    it(name, async () => {
      const w = await makeWorld(station100);
      await expect(upload(w, make())).rejects.toMatchObject({ status: 400, field, message: expect.stringMatching(message) });
      expect(await listUploads(w.networkId)).toHaveLength(0);
    });
  }

  it('keeps header keys the layout does not define, listed as warnings on the upload', async () => {
    const w = await makeWorld(station100);
    const text = seriesCsv(spec({ seconds: 20 })).replace('# units:', '# operator: night shift\n# units:');
    const { upload: u } = await upload(w, text);
    expect(u.warnings).toEqual(['rec.csv, line 5: header key "operator" is not part of the layout and was ignored']);
    expect((await listUploads(w.networkId))[0].warnings).toEqual(u.warnings);
  });

  it('files over the size limit (413), whether announced or streamed', async () => {
    process.env.UPLOAD_MAX_MB = '0.01'; // about 10 kB
    const w = await makeWorld(station100);
    const text = seriesCsv(spec({ seconds: 10 }));
    await expect(upload(w, text)).rejects.toMatchObject({ status: 413, field: 'file' });
    await expect(
      receiveUpload({ station: w.station, userId: w.userId, fileName: 'x.csv', body: bodyOf(text), contentLength: null }),
    ).rejects.toMatchObject({ status: 413, message: expect.stringMatching(/larger than the 10 kB limit/) });
    expect(await listUploads(w.networkId)).toHaveLength(0);
  });
});

describe('the process-upload worker job', () => {
  it('picks up a queued upload and processes it', async () => {
    const { serveJobs } = await import('@/src/worker/run');
    const { job } = await import('@/src/worker/jobs/process-upload');
    const handle = await serveJobs([{ ...job, pollingIntervalSeconds: 0.5 }], () => {});
    try {
      const w = await makeWorld(station100);
      const { upload: u } = await upload(w, seriesCsv(spec({ seed: 21 })), 'queued.csv');
      let state = u.state;
      for (let i = 0; i < 240 && state !== 'done' && state !== 'failed'; i++) {
        await new Promise((r) => setTimeout(r, 500));
        state = (await getUpload(w.networkId, u.id))!.state;
      }
      expect(state).toBe('done');
      expect((await listIntervals({ networkId: w.networkId })).length).toBe(2);
    } finally {
      await handle.stop(5000);
    }
  });
});
