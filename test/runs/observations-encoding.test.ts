/**
 * The run's loader reads stored spectra in PostgreSQL's binary array form (array_send) instead of its
 * decimal text form. Over a stored day, both give exactly the numbers that were saved (bit for bit,
 * Object.is, including the smallest subnormal, the largest double and NaN), and the loader hands
 * out exactly the observations it hands out when the spectra come through the plain text query.
 */
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { closeDatabase, resetDatabase } from '@/test/helpers/db';
import { saveIntervals } from '@/db/repo/intervals';
import * as repo from '@/db/repo/intervals';
import { syntheticRows, tenMinuteStarts } from '@/src/runs/synthetic-network';
import { gammaDeviate, mulberry32 } from '@/src/engine/random';
import type { RunConfig } from '@/src/runs/config';
import { intervalLoader } from '@/src/runs/observations';
import { BAND, makeRunWorld, SEGMENTS, truthSpectra } from './world';

// Which query the loader's getIntervalSpectra goes through: the binary one under test, or the plain text one.
const via = vi.hoisted(() => ({ plain: false }));
vi.mock('@/db/repo/intervals', async (importOriginal) => {
  const m = await importOriginal<typeof import('@/db/repo/intervals')>();
  return {
    ...m,
    getIntervalSpectra: (f: Parameters<typeof m.getIntervalSpectra>[0]) =>
      via.plain ? m.getIntervalSpectraPlain(f) : m.getIntervalSpectra(f),
  };
});

const sameBits = (a: readonly number[], b: readonly number[]) => a.length === b.length && a.every((x, k) => Object.is(x, b[k]));

describe('stored spectra read in binary form', () => {
  beforeAll(resetDatabase);
  afterAll(closeDatabase);

  it('give the saved numbers and the same run observations as the text form, over a day', async () => {
    const w = await makeRunWorld(1);
    const day = Date.UTC(2031, 6, 3);
    const starts = tenMinuteStarts(day, 144);
    const spectra = truthSpectra(w, BAND, ['Ez', 'Bns', 'Bew']);
    // Welch-like scatter (power x Gamma(K, 1/K), K = SEGMENTS), so the doubles use all 17 digits; the first
    // spectrum of the day carries IEEE 754 edge values (IEEE 754-2008: 2^-1074, the largest finite double,
    // NaN), which the run leaves out as bins but which must still come back unchanged. (-0 is not among them:
    // saving sends numbers as decimal text, and JavaScript prints -0 as "0".)
    const rand = mulberry32(7);
    const edges = [5e-324, 1.7976931348623157e308, Number.NaN, 0.1 + 0.2];
    const saved = starts.flatMap((t, i) =>
      syntheticRows(w.networkId, w.stations, spectra, t, SEGMENTS, {
        power: (sp, j) =>
          sp.power.map((p, k) =>
            i === 0 && j === 0 && k < edges.length ? edges[k] : (p * gammaDeviate(rand, SEGMENTS)) / SEGMENTS,
          ),
      }),
    );
    // One interval of one series on another grid, so the frequencies change within the series and back.
    const moved = saved[50 * spectra.length + 4].spectrum;
    moved.frequencies = moved.frequencies.map((f) => f + 0.25);
    await saveIntervals(saved);
    const key = (stationId: string, component: string, t: Date) => `${stationId} ${component} ${t.getTime()}`;
    const byKey = new Map(saved.map((s) => [key(s.stationId, s.component, s.startsAt), s.spectrum]));

    const filter = { networkId: w.networkId, from: starts[0], to: new Date(day + 86_400_000) };
    const binary = await repo.getIntervalSpectra(filter);
    const text = await repo.getIntervalSpectraPlain(filter);
    expect(binary.length).toBe(144 * 9);
    expect(binary.map((s) => s.intervalId)).toEqual(text.map((s) => s.intervalId));
    for (let k = 0; k < binary.length; k++) {
      const b = binary[k];
      const want = byKey.get(key(b.stationId, b.component, b.startsAt))!;
      expect(sameBits(b.frequencies, want.frequencies) && sameBits(b.power, want.power)).toBe(true);
      expect(sameBits(text[k].frequencies, want.frequencies) && sameBits(text[k].power, want.power)).toBe(true);
      expect({ ...b, frequencies: [], power: [] }).toEqual({ ...text[k], frequencies: [], power: [] });
    }

    // The run's loader over the day, with the full band and with every third bin of a narrower one.
    const narrow: RunConfig = { ...w.config, observables: { kind: 'spectrum', minHz: 7.5, maxHz: 24, every: 3 } };
    for (const config of [w.config, narrow]) {
      const load = async (plain: boolean) => {
        via.plain = plain;
        const next = intervalLoader(w.networkId, config, starts);
        const out = [];
        for (const t of starts) out.push((await next(t)).observed);
        return out;
      };
      const fromBinary = await load(false);
      const fromText = await load(true);
      via.plain = false;
      expect(fromBinary.map((o) => o.length)).toEqual(starts.map(() => 9));
      expect(fromBinary).toEqual(fromText);
      expect(
        fromBinary
          .flat()
          .every(
            (s, k) => sameBits(s.power, fromText.flat()[k].power) && sameBits(s.frequencies, fromText.flat()[k].frequencies),
          ),
      ).toBe(true);
    }
  });
});
