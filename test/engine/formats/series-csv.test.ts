import { createReadStream, readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { openSeriesCsv, type SeriesBlock } from '@/src/engine/formats/series-csv';
import { FormatError } from '@/src/engine/formats/format-error';

const dir = new URL('../../../fixtures/series/', import.meta.url);
const path = (name: string) => new URL(name, dir).pathname;

async function readAll(name: string, blockSamples?: number) {
  const reader = await openSeriesCsv(createReadStream(path(name)), name, { blockSamples });
  const blocks: SeriesBlock[] = [];
  for await (const b of reader.blocks) blocks.push(b);
  return { header: reader.header, blocks };
}

async function failure(name: string): Promise<FormatError> {
  try {
    await readAll(name);
  } catch (e) {
    if (e instanceof FormatError) return e;
    throw e;
  }
  throw new Error(`${name} was accepted`);
}

describe('series CSV reader', () => {
  it('reads the example file with its header and every sample, in blocks', async () => {
    const { header, blocks } = await readAll('example-series.csv', 1500);
    expect(header).toMatchObject({
      station: 'KESTREL-2',
      sampleRateHz: 200,
      startUtc: '2026-03-14T00:00:00Z',
      components: ['Ez', 'Bns', 'Bew'],
    });
    expect(header.startMs).toBe(Date.UTC(2026, 2, 14));
    expect(header.units).toEqual({ Ez: 'mV/m', Bns: 'pT', Bew: 'pT' });
    expect(blocks.map((b) => b.length)).toEqual([1500, 1500, 1000]);
    expect(blocks.map((b) => b.firstSample)).toEqual([0, 1500, 3000]);
    // spot-check against the text itself
    const row = readFileSync(path('example-series.csv'), 'utf8').split('\n')[6 + 3210].split(',').map(Number);
    expect(blocks[2].columns[1][210]).toBe(row[2]);
    expect(row[0]).toBeCloseTo(3210 / 200, 9);
  });

  it('turns missing rows into a gap between blocks', async () => {
    const { blocks } = await readAll('example-series-gap.csv');
    expect(blocks.map((b) => [b.firstSample, b.length])).toEqual([
      [0, 1000],
      [1400, 2600],
    ]);
  });

  it.each([
    ['bad-truncated.csv', 57, null, /expected 4 cells.*cut off/],
    ['bad-missing-column.csv', 5, 'units', /names Bew but the file has no Bew column/],
    ['bad-unknown-column.csv', 6, 'Bx', /unknown column/],
    ['bad-cell.csv', 11, 'Bns', /"abc" is not a number/],
    ['bad-nan.csv', 9, 'Ez', /NaN is not allowed/],
    ['bad-rate.csv', 8, 'seconds', /sample grid.*sample-rate-hz/],
    ['bad-off-grid.csv', 8, 'seconds', /0\.005.*sample-rate-hz 400/],
    ['bad-order.csv', 14, 'seconds', /out of order/],
    ['bad-overlap.csv', 15, 'seconds', /overlap/],
    ['bad-missing-rate.csv', 5, 'sample-rate-hz', /needs a/],
  ])('%s: names line %i and field %s', async (name, line, field, message) => {
    const err = await failure(name);
    expect(err.file).toBe(name);
    expect(err.line).toBe(line);
    expect(err.field).toBe(field);
    expect(err.message).toMatch(message);
    expect(err.message).toContain(`${name}, line ${line}`);
  });

  it('checks the header fields themselves', async () => {
    const head = (lines: string[]) => openSeriesCsv([lines.join('\n') + '\n0,1\n0.005,2\n'], 'h.csv');
    await expect(head(['# other-layout 1'])).rejects.toThrow(/line 1.*cavitas-series 1/);
    await expect(head(['# cavitas-series 2'])).rejects.toThrow(/version 2/);
    const ok = [
      '# cavitas-series 1',
      '# station: A1',
      '# sample-rate-hz: 200',
      '# start-utc: 2026-03-14T00:00:00Z',
      '# units: Ez=V/m',
      'seconds,Ez',
    ];
    await expect(head(ok)).resolves.toBeTruthy();
    await expect(head(ok.map((l) => l.replace('2026-03-14T00', '2026-02-30T00')))).rejects.toThrow(/line 4, field "start-utc"/);
    await expect(head(ok.map((l) => l.replace('Ez=V/m', 'Ez=V/m, Bns=pT')))).rejects.toThrow(
      /line 5, field "units".*no Bns column/,
    );
    await expect(head([...ok.slice(0, 2), '# station: B2', ...ok.slice(2)])).rejects.toThrow(
      /line 3, field "station": appears twice/,
    );
    await expect(head(ok.map((l) => l.replace('seconds,Ez', 'seconds,Ez,Ez')))).rejects.toThrow(
      /field "Ez": column appears twice/,
    );
  });

  it('accepts CRLF line ends and byte chunks split anywhere', async () => {
    const text =
      [
        '# cavitas-series 1',
        '# station: A1',
        '# sample-rate-hz: 4',
        '# start-utc: 2026-03-14T00:00:00Z',
        '# units: Bew=pT',
        'seconds,Bew',
        '0,1.5',
        '0.25,-2',
        '0.5,3e-1',
      ].join('\r\n') + '\r\n';
    const bytes = new TextEncoder().encode(text);
    const chunks = [bytes.subarray(0, 7), bytes.subarray(7, 100), bytes.subarray(100)];
    const reader = await openSeriesCsv(chunks, 'crlf.csv');
    const out: number[] = [];
    for await (const b of reader.blocks) out.push(...b.columns[0]);
    expect(out).toEqual([1.5, -2, 0.3]);
  });

  it('decodes UTF-8 split between chunks (a unit written with the micro sign)', async () => {
    const text =
      '# cavitas-series 1\n# station: A1\n# sample-rate-hz: 2\n# start-utc: 2026-03-14T00:00:00Z\n# units: Ez=\u00b5V/m\nseconds,Ez\n0,1\n0.5,2\n';
    const bytes = new TextEncoder().encode(text);
    const cut = bytes.indexOf(0xc2) + 1; // between the two bytes of U+00B5
    const reader = await openSeriesCsv([bytes.subarray(0, cut), bytes.subarray(cut)], 'micro.csv');
    expect(reader.header.units.Ez).toBe('\u00b5V/m');
  });
});
