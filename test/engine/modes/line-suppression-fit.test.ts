import { describe, expect, it } from 'vitest';
import { fitModes } from '@/src/engine/modes/fit-modes';
import { listedLines, mainsLines, suppressLines } from '@/src/engine/signal/line-suppression';
import { welch } from '@/src/engine/signal/welch';
import { lorentzSum, seriesWithPsd, type TrueModes } from './synthetic';

const SEVEN: TrueModes = {
  f: [7.85, 14.15, 20.4, 26.5, 32.7, 38.9, 45.1],
  a: [1.0, 0.7, 0.5, 0.36, 0.26, 0.19, 0.14],
  g: [0.9, 1.35, 1.8, 2.1, 2.4, 2.7, 3.0],
  b0: 0.12,
  b1: -1e-3,
};
const fs = 200;
const lines = [...mainsLines(50, fs / 2), ...listedLines([{ frequencyHz: 50 / 3 }])];
const band = { modes: 7, minHz: 3, maxHz: 55 };
const tones = (j: number) => 6 * Math.sin(2 * Math.PI * 50.03 * (j / fs) + 1) + 4 * Math.sin(2 * Math.PI * (50 / 3) * (j / fs));

describe('line suppression before a mode fit', () => {
  it('removes 50 Hz mains and a 16.7 Hz line added to a model spectrum without moving modes by 0.01 Hz', () => {
    // The lines enter as Welch sees them: the Hann-windowed estimate of the two tones alone.
    const lineShape = welch(
      Float64Array.from({ length: fs * 120 }, (_, j) => tones(j)),
      { sampleRateHz: fs, segmentLength: 10 * fs },
    );
    const f = lineShape.frequencies;
    const clean = Float64Array.from(f, (v) => lorentzSum(SEVEN, v));
    const dirty = clean.map((v, k) => v + lineShape.power[k]);
    expect(dirty[Math.round(50 / 0.1)] / clean[Math.round(50 / 0.1)]).toBeGreaterThan(100);
    const ref = fitModes(f, clean, band);
    const got = fitModes(f, suppressLines(f, dirty, lines).power, band);
    const raw = fitModes(f, dirty, band);
    ref.modes.forEach((m, n) => {
      expect(m.frequency).toBeCloseTo(SEVEN.f[n], 6);
      expect(Math.abs(got.modes[n].frequency - m.frequency)).toBeLessThan(0.01);
    });
    // unsuppressed, the lines pull the fit away (the check above could fail)
    expect(raw.misfit).toBeGreaterThan(100 * got.misfit + 1e-6);
  });

  it('does the same on Welch spectra of a synthetic time series', () => {
    const clean = seriesWithPsd((v) => lorentzSum(SEVEN, v), fs, 17, 4242);
    const dirty = clean.map((v, j) => v + tones(j));
    const opts = { sampleRateHz: fs, segmentLength: 10 * fs };
    const pc = welch(clean, opts);
    const pd = welch(dirty, opts);
    const k167 = Math.round(50 / 3 / 0.1);
    expect(pd.power[k167] / pc.power[k167]).toBeGreaterThan(50);
    const withAverages = { ...band, averages: pc.used };
    // reference: the clean spectrum with the same bins bridged, so only the lines' influence is measured
    const ref = fitModes(pc.frequencies, suppressLines(pc.frequencies, pc.power, lines).power, withAverages);
    const dirtyBridged = suppressLines(pd.frequencies, pd.power, lines);
    const got = fitModes(pd.frequencies, dirtyBridged.power, withAverages);
    const refIgnored = fitModes(pc.frequencies, pc.power, { ...withAverages, exclude: dirtyBridged.suppressed });
    const ignored = fitModes(pd.frequencies, pd.power, { ...withAverages, exclude: dirtyBridged.suppressed });
    expect(ref.flags).toEqual([]);
    ref.modes.forEach((m, n) => {
      expect(Math.abs(got.modes[n].frequency - m.frequency)).toBeLessThan(0.01);
      expect(Math.abs(ignored.modes[n].frequency - refIgnored.modes[n].frequency)).toBeLessThan(0.01);
      // the fit finds the modes the series was built with (Timmer & König synthesis), within its errors
      expect(Math.abs(m.frequency - SEVEN.f[n])).toBeLessThan(4 * m.errors.frequency);
    });
  });
});
