import { describe, expect, it } from 'vitest';
import { listedLines, mainsLines, suppressLines } from '@/src/engine/signal/line-suppression';
import { welch } from '@/src/engine/signal/welch';
import { gaussian, mulberry32 } from '@/src/engine/random';

describe('line suppression', () => {
  it('lists the mains line and its harmonics up to the top frequency', () => {
    expect(mainsLines(50, 100).map((l) => l.frequencyHz)).toEqual([50, 100]);
    expect(mainsLines(60, 200).map((l) => l.frequencyHz)).toEqual([60, 120, 180]);
    expect(() => listedLines([{ frequencyHz: -1 }])).toThrow(/line 1/);
  });

  it('removes a 50 Hz mains line, its 100 Hz harmonic and a 16.7 Hz railway line from a Welch spectrum', () => {
    // White noise of variance s^2 has the flat one-sided density 2 s^2 / fs (definition of density scaling).
    const fs = 250;
    const rand = mulberry32(5);
    const x = Float64Array.from({ length: fs * 300 }, (_, j) => {
      const t = j / fs;
      return (
        gaussian(rand) +
        5 * Math.sin(2 * Math.PI * 50.02 * t) +
        1 * Math.sin(2 * Math.PI * 100.04 * t) +
        2 * Math.sin(2 * Math.PI * (50 / 3) * t)
      );
    });
    const est = welch(x, { sampleRateHz: fs, segmentLength: fs * 10 });
    const lines = [...mainsLines(50, fs / 2), ...listedLines([{ frequencyHz: 50 / 3 }])];
    const out = suppressLines(est.frequencies, est.power, lines);
    const floor = 2 / fs;
    for (const f0 of [50 / 3, 50, 100]) {
      const k = Math.round(f0 / 0.1);
      expect(est.power[k] / floor).toBeGreaterThan(100);
      for (let j = k - 8; j <= k + 8; j++) expect(Math.abs(Math.log(out.power[j] / floor))).toBeLessThan(0.5);
    }
    // bins away from the lines are untouched
    expect(out.power[200]).toBe(est.power[200]);
    expect(out.suppressed.reduce((a, b) => a + b, 0)).toBe(11 + 11 + 6);
  });

  it('bridges a notch by a straight line in log power', () => {
    const f = Float64Array.from({ length: 41 }, (_, k) => k * 0.5);
    const p = Float64Array.from(f, (v) => Math.exp(-0.1 * v));
    p[20] = 1e3;
    const out = suppressLines(f, p, [{ frequencyHz: 10, halfWidthHz: 0.6 }]);
    for (const k of [19, 20, 21]) expect(out.power[k]).toBeCloseTo(Math.exp(-0.1 * f[k]), 12);
  });
});
