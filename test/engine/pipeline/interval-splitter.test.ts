import { createReadStream } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { IntervalSplitter, splitIntervals, type IntervalSamples } from '@/src/engine/pipeline/interval-splitter';
import { processSeries } from '@/src/engine/pipeline/series-intervals';
import { openSeriesCsv } from '@/src/engine/formats/series-csv';

const fs = 10;
const startMs = Date.UTC(2026, 2, 14, 0, 7, 30); // 00:07:30, mid-interval

function blocks(total: number, size: number, skip?: [number, number]) {
  const out: { firstSample: number; length: number; columns: Float64Array[] }[] = [];
  for (let s = 0; s < total; s += size) {
    const idx = Array.from({ length: Math.min(size, total - s) }, (_, j) => s + j).filter(
      (i) => !skip || i < skip[0] || i >= skip[1],
    );
    // split at the skipped range so that blocks stay contiguous
    let run: number[] = [];
    const flush = () => {
      if (run.length)
        out.push({
          firstSample: run[0],
          length: run.length,
          columns: [Float64Array.from(run), Float64Array.from(run, (i) => -i)],
        });
      run = [];
    };
    for (const i of idx) {
      if (run.length && i !== run[run.length - 1] + 1) flush();
      run.push(i);
    }
    flush();
  }
  return out;
}

describe('interval splitter', () => {
  it('cuts a record into UTC-aligned intervals, NaN where no sample came', () => {
    const total = 25 * 60 * fs; // 25 minutes: 00:07:30 .. 00:32:30
    const splitter = new IntervalSplitter({ sampleRateHz: fs, startMs, components: 2 });
    const got: IntervalSamples[] = [];
    for (const b of blocks(total, 777, [9000, 9050])) got.push(...splitter.push(b));
    got.push(...splitter.finish());
    expect(got.map((i) => new Date(i.startMs).toISOString())).toEqual([
      '2026-03-14T00:00:00.000Z',
      '2026-03-14T00:10:00.000Z',
      '2026-03-14T00:20:00.000Z',
      '2026-03-14T00:30:00.000Z',
    ]);
    expect(got.map((i) => i.missing)).toEqual([4500, 0, 50, 6000 - 1500]);
    // sample i sits at 00:07:30 + i/fs: sample 1500 starts the 00:10 interval, sample 0 is at offset 4500 of the first
    expect(got[0].columns[0][4500]).toBe(0);
    expect(Number.isNaN(got[0].columns[0][4499])).toBe(true);
    expect(got[1].columns[0][0]).toBe(1500);
    expect(got[1].columns[1][5999]).toBe(-7499);
    expect(Number.isNaN(got[2].columns[0][9000 - 7500])).toBe(true);
    expect(got[3].columns[0][1499]).toBe(total - 1);
  });

  it('gives the same intervals whatever the block size', async () => {
    const run = async (size: number) => {
      const out: IntervalSamples[] = [];
      async function* src() {
        yield* blocks(12_000, size);
      }
      for await (const i of splitIntervals(src(), { sampleRateHz: fs, startMs, components: 2 })) out.push(i);
      return out;
    };
    const a = await run(7);
    const b = await run(6000);
    const c = await run(5000);
    expect(b).toEqual(a);
    expect(c).toEqual(a);
  });

  it('refuses blocks that go back in time and intervals that are not whole samples', () => {
    const s = new IntervalSplitter({ sampleRateHz: fs, startMs, components: 1 });
    s.push({ firstSample: 0, length: 10, columns: [new Float64Array(10)] });
    expect(() => s.push({ firstSample: 5, length: 10, columns: [new Float64Array(10)] })).toThrow(/overlaps/);
    expect(() => new IntervalSplitter({ sampleRateHz: 3, startMs, components: 1, intervalSeconds: 0.5 })).toThrow(/whole number/);
  });

  it('runs a station file through splitting and processing', async () => {
    const name = 'example-series-gap.csv';
    const reader = await openSeriesCsv(
      createReadStream(new URL(`../../../fixtures/series/${name}`, import.meta.url).pathname),
      name,
    );
    const out = [];
    for await (const p of processSeries(reader, () => ({ segmentSeconds: 1, modes: 0, mainsHz: 50 }), { intervalSeconds: 10 }))
      out.push(p);
    expect(out.map((p) => [new Date(p.startMs).toISOString().slice(11, 19), p.component, p.missing])).toEqual([
      ['00:00:00', 'Ez', 400],
      ['00:00:00', 'Bns', 400],
      ['00:00:00', 'Bew', 400],
      ['00:00:10', 'Ez', 0],
      ['00:00:10', 'Bns', 0],
      ['00:00:10', 'Bew', 0],
    ]);
    expect(out[0].result.flags).toContain('gaps');
    expect(out[3].result.flags).toEqual([]);
    expect(out[3].result.segments).toBe(19);
  });
});
