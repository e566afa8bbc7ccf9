import { createReadStream } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { readSpectraCsv } from '@/src/engine/formats/spectra-csv';

const dir = new URL('../../../fixtures/series/', import.meta.url);
const open = (name: string) => readSpectraCsv(createReadStream(new URL(name, dir).pathname), name);

describe('spectra CSV reader', () => {
  it('reads the example: one power column per interval', async () => {
    const s = await open('example-spectra.csv');
    expect(s).toMatchObject({ station: 'KESTREL-2', component: 'Bns', units: 'pT^2/Hz', intervalSeconds: 600 });
    expect(s.frequencies.length).toBe(421);
    expect(s.frequencies[0]).toBe(3);
    expect(s.frequencies[420]).toBe(45);
    expect(s.intervals.map((i) => i.startUtc)).toEqual(['2026-03-14T00:00:00Z', '2026-03-14T00:10:00Z', '2026-03-14T00:20:00Z']);
    expect(s.intervals[1].startMs - s.intervals[0].startMs).toBe(600_000);
    expect(s.intervals.every((i) => i.power.length === 421)).toBe(true);
  });

  it('names overlapping intervals and negative power', async () => {
    await expect(open('bad-spectra-overlap.csv')).rejects.toThrow(
      /bad-spectra-overlap\.csv, line 6, field "2026-03-14T00:05:00Z": overlaps/,
    );
    await expect(open('bad-spectra-negative.csv')).rejects.toThrow(
      /line 21, field "2026-03-14T00:20:00Z": "-0\.5" is not a power/,
    );
  });

  it('names decreasing frequencies, bad headings and short rows', async () => {
    const head = '# cavitas-spectra 1\n# station: A1\n# component: Ez\n# units: (V/m)^2/Hz\n# interval-seconds: 600\n';
    const parse = (body: string) => readSpectraCsv([head + body], 'x.csv');
    await expect(parse('frequency-hz,2026-03-14T00:00:00Z\n3,1\n2.9,1\n')).rejects.toThrow(
      /line 8, field "frequency-hz": 2.9 Hz does not increase/,
    );
    await expect(parse('frequency-hz,noon\n3,1\n')).rejects.toThrow(/line 6, field "noon"/);
    await expect(parse('frequency-hz,2026-03-14T00:10:00Z,2026-03-14T00:00:00Z\n3,1,1\n')).rejects.toThrow(/must increase/);
    await expect(parse('frequency-hz,2026-03-14T00:00:00Z\n3,1\n3.1')).rejects.toThrow(
      /line 8: expected 2 cells, found 1 \(the file seems cut off\)/,
    );
    await expect(parse('frequency-hz,2026-03-14T00:00:00Z\n3,nan\n')).rejects.toThrow(
      /line 7, field "2026-03-14T00:00:00Z": NaN/,
    );
    await expect(readSpectraCsv([head.replace('Ez', 'Bz') + 'frequency-hz,2026-03-14T00:00:00Z\n'], 'y.csv')).rejects.toThrow(
      /line 3, field "component"/,
    );
  });
});
