/**
 * The two ten-minute example series in fixtures/series (written by generate.py beside them) go
 * through the same processing as an upload to their demo station: each gives one whole interval
 * per component, keeps nearly every Welch segment and yields a mode fit without quality flags.
 * The generator shapes its noise with five Lorentzian modes at 7.9, 14.2, 20.5, 26.6 and 32.8 Hz
 * (half-widths 0.9 to 2.6 Hz; frequency-domain synthesis after Timmer & Koenig 1995), so the five
 * fitted modes must come back near those frequencies.
 */
import { createReadStream } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { openSeriesCsv } from '@/src/engine/formats/series-csv';
import { processSeries, type ProcessedInterval } from '@/src/engine/pipeline/series-intervals';
import { processingConfigFor } from '@/src/data/interval-processing';
import { DEMO_STATIONS, demoStationInput } from '@/src/ops/seed/stations';

const GENERATED_MODES_HZ = [7.9, 14.2, 20.5, 26.6, 32.8];

async function processFixture(code: string): Promise<ProcessedInterval[]> {
  const name = `ten-minutes-${code}.csv`;
  const reader = await openSeriesCsv(createReadStream(new URL(`../../fixtures/series/${name}`, import.meta.url).pathname), name);
  expect(reader.header.station).toBe(code);
  const station = demoStationInput(DEMO_STATIONS.find((d) => d.code === code)!);
  const out: ProcessedInterval[] = [];
  for await (const p of processSeries(reader, (c) => processingConfigFor(station, c, reader.header.sampleRateHz))) out.push(p);
  return out;
}

describe('ten-minute example series', () => {
  it.each(['BRQ', 'FLV'])('%s processes as one clean interval per component with modes where they were made', async (code) => {
    const out = await processFixture(code);
    expect(out.map((p) => [new Date(p.startMs).toISOString(), p.component, p.missing])).toEqual([
      ['2026-03-15T00:00:00.000Z', 'Ez', 0],
      ['2026-03-15T00:00:00.000Z', 'Bns', 0],
      ['2026-03-15T00:00:00.000Z', 'Bew', 0],
    ]);
    for (const { result } of out) {
      expect(result.flags).toEqual([]);
      expect(result.rejectedShare).toBeLessThanOrEqual(0.05);
      // 600 s in 10 s Hann segments with 50 % overlap: 119 segments (Welch 1967)
      expect(result.segments).toBeGreaterThanOrEqual(113);
      expect(result.fit).not.toBeNull();
      const fitted = result.fit!.modes.map((m) => m.frequency);
      expect(fitted).toHaveLength(GENERATED_MODES_HZ.length);
      GENERATED_MODES_HZ.forEach((f, i) => expect(Math.abs(fitted[i] - f)).toBeLessThan(0.3));
    }
  });
});
