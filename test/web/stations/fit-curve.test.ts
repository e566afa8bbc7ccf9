/**
 * The fitted curve is drawn only over the band it was fitted on. Reference values: the Lorentzian
 * A / (1 + ((f - f0)/g)^2) equals A at f0 and A/2 at f0 ± g (half width at half maximum, by definition).
 */
import { describe, expect, it } from 'vitest';
import { fitModel, fittedBand, fittedCurve, qFactorError } from '@/src/web/stations/fit-curve';

const fit = {
  modes: [
    { frequency: 7.8, amplitude: 4, halfWidth: 1 },
    { frequency: 14.1, amplitude: 2, halfWidth: 1.5 },
  ],
  background: { b0: 0.5, b1: -0.02 }, // falls below zero above 25 Hz
};

describe('fitted curve', () => {
  const grid = Array.from({ length: 401 }, (_, i) => i * 0.1); // 0..40 Hz

  it('evaluates the Lorentzian sum plus the linear background', () => {
    const bg = (f: number) => 0.5 - 0.02 * f;
    const other = (f: number) => 2 / (1 + ((f - 14.1) / 1.5) ** 2);
    const [atPeak, atHalf] = fitModel(fit, [7.8, 8.8]);
    expect(atPeak).toBeCloseTo(4 + bg(7.8) + other(7.8), 12);
    expect(atHalf - bg(8.8) - other(8.8)).toBeCloseTo(2, 12);
  });

  it('stays inside the recorded band', () => {
    const pts = fittedCurve({ ...fit, band: { minHz: 5, maxHz: 20 } }, grid);
    expect(pts.length).toBeGreaterThan(100);
    expect(Math.min(...pts.map((p) => p.f))).toBeGreaterThanOrEqual(5);
    expect(Math.max(...pts.map((p) => p.f))).toBeLessThanOrEqual(20);
  });

  it('for a fit without a recorded band, spans the modes ± 3 half-widths and drops non-positive power', () => {
    expect(fittedBand(fit)).toEqual({ minHz: 7.8 - 3, maxHz: 14.1 + 4.5 });
    const pts = fittedCurve(fit, grid);
    expect(Math.max(...pts.map((p) => p.f))).toBeLessThanOrEqual(18.6);
    for (const p of pts) expect(p.p).toBeGreaterThan(0);
    expect(fittedCurve({ ...fit, modes: [] }, grid)).toEqual([]);
  });
});

describe('Q-factor error', () => {
  it('propagates the frequency and half-width errors (checked against a Monte Carlo spread)', () => {
    const m = { frequency: 8, halfWidth: 1, errors: { frequency: 0.08, halfWidth: 0.02 } };
    expect(qFactorError(m)).toBeCloseTo(4 * Math.sqrt(0.01 ** 2 + 0.02 ** 2), 12);
    // independent normal draws (Box–Muller, fixed seed): the spread of f / 2g agrees to 3 %
    let seed = 12345;
    const u = () => (seed = (seed * 16807) % 2147483647) / 2147483647;
    const normal = () => Math.sqrt(-2 * Math.log(u())) * Math.cos(2 * Math.PI * u());
    const qs = Array.from({ length: 20000 }, () => (8 + 0.08 * normal()) / (2 * (1 + 0.02 * normal())));
    const mean = qs.reduce((a, b) => a + b) / qs.length;
    const sd = Math.sqrt(qs.reduce((a, b) => a + (b - mean) ** 2, 0) / (qs.length - 1));
    expect(Math.abs(sd / qFactorError(m) - 1)).toBeLessThan(0.03);
  });
});
