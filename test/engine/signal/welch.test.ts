import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { welch } from '@/src/engine/signal/welch';
import { hannWindow, windowPower } from '@/src/engine/signal/hann';
import { complexDft } from '@/src/engine/signal/complex-dft';
import { realPowerPlan } from '@/src/engine/signal/real-power';
import { mulberry32, gaussian } from '@/src/engine/random';

interface WelchCase {
  name: string;
  sampleRateHz: number;
  nperseg: number;
  samples: number[];
  frequencies: number[];
  power: number[];
}
const fixture = JSON.parse(readFileSync(new URL('../../../fixtures/welch/welch-cases.json', import.meta.url), 'utf8')) as {
  cases: WelchCase[];
};

describe('DFT of any length', () => {
  // Reference: the DFT definition X_k = sum_j x_j exp(-2 pi i jk/m), summed directly.
  it.each([7, 12, 16, 250, 1000])('matches the direct sum for m = %i', (m) => {
    const rand = mulberry32(m);
    const input = new Float64Array(2 * m).map(() => rand() - 0.5);
    const out = new Float64Array(2 * m);
    complexDft(m).forward(input, out);
    let worst = 0;
    let scale = 0;
    for (let k = 0; k < m; k++) {
      let re = 0,
        im = 0;
      for (let j = 0; j < m; j++) {
        const a = (-2 * Math.PI * ((j * k) % m)) / m;
        re += input[2 * j] * Math.cos(a) - input[2 * j + 1] * Math.sin(a);
        im += input[2 * j] * Math.sin(a) + input[2 * j + 1] * Math.cos(a);
      }
      worst = Math.max(worst, Math.hypot(out[2 * k] - re, out[2 * k + 1] - im));
      scale = Math.max(scale, Math.hypot(re, im));
    }
    expect(worst / scale).toBeLessThan(1e-11);
  });

  it('real-input power equals |X_k|^2 of the complex transform (odd and even lengths)', () => {
    for (const n of [9, 2000]) {
      const rand = mulberry32(n);
      const x = new Float64Array(n).map(() => rand() - 0.5);
      const packed = new Float64Array(2 * n);
      x.forEach((v, j) => (packed[2 * j] = v));
      const full = new Float64Array(2 * n);
      complexDft(n).forward(packed, full);
      const plan = realPowerPlan(n);
      const p = new Float64Array(plan.bins);
      plan.power(x, p);
      for (let k = 0; k < plan.bins; k++) {
        expect(p[k]).toBeCloseTo(full[2 * k] ** 2 + full[2 * k + 1] ** 2, 8);
      }
    }
  });
});

describe('Welch PSD', () => {
  // Reference: scipy.signal.welch (fixtures/welch/generate.py), hann window, defaults otherwise.
  it.each(fixture.cases.map((c) => [c.name, c] as const))('matches scipy.signal.welch: %s', (_name, c) => {
    const est = welch(c.samples, { sampleRateHz: c.sampleRateHz, segmentLength: c.nperseg });
    expect(est.frequencies.length).toBe(c.frequencies.length);
    const peak = Math.max(...c.power);
    for (let k = 0; k < c.power.length; k++) {
      expect(est.frequencies[k]).toBeCloseTo(c.frequencies[k], 9);
      const err = Math.abs(est.power[k] - c.power[k]);
      expect(err).toBeLessThanOrEqual(1e-6 * Math.max(Math.abs(c.power[k]), 1e-9 * peak));
    }
  });

  it('integrated PSD equals the windowed variance exactly (Parseval) and the variance of white noise', () => {
    const fs = 200;
    const rand = mulberry32(7);
    const x = Float64Array.from({ length: fs * 600 }, () => 2 + 0.5 * gaussian(rand));
    const n = 2000;
    const est = welch(x, { sampleRateHz: fs, segmentLength: n });
    const df = fs / n;
    const integral = est.power.reduce((s, v) => s + v, 0) * df;
    // Parseval's theorem for the DFT: sum_k |X_k|^2 = n sum_j y_j^2, per segment.
    const w = hannWindow(n);
    let expected = 0;
    for (let s = 0; s < est.layout.count; s++) {
      const seg = x.subarray(s * est.layout.step, s * est.layout.step + n);
      const mean = seg.reduce((a, b) => a + b, 0) / n;
      let acc = 0;
      for (let j = 0; j < n; j++) acc += ((seg[j] - mean) * w[j]) ** 2;
      expected += acc / windowPower(w);
    }
    expected /= est.layout.count;
    expect(Math.abs(integral - expected) / expected).toBeLessThan(1e-10);
    // and for stationary noise of variance 0.25 the expectation is that variance (119 segments: ~2 % scatter)
    expect(Math.abs(integral - 0.25) / 0.25).toBeLessThan(0.03);
  });

  it('a sinusoid of amplitude A carries power A^2/2 under its peak', () => {
    // Power of A sin(2 pi f t) is A^2/2 (any signals textbook, e.g. Bendat & Piersol, Random Data).
    const fs = 200;
    const n = 2000;
    const df = fs / n;
    for (const [amp, f0] of [
      [3, 16.7],
      [0.25, 50],
      [1.2, 7.83],
    ]) {
      const x = Float64Array.from({ length: fs * 120 }, (_, j) => amp * Math.sin(2 * Math.PI * f0 * (j / fs) + 0.4));
      const est = welch(x, { sampleRateHz: fs, segmentLength: n });
      let peak = 0;
      for (let k = 0; k < est.frequencies.length; k++) {
        if (Math.abs(est.frequencies[k] - f0) <= 1) peak += est.power[k] * df;
      }
      expect(Math.abs(peak - (amp * amp) / 2) / ((amp * amp) / 2)).toBeLessThan(2e-3);
    }
  });

  it('leaves out chosen segments and segments with missing samples', () => {
    const fs = 100;
    const rand = mulberry32(3);
    const x = Float64Array.from({ length: 1000 }, () => gaussian(rand));
    const keep = new Uint8Array(9).fill(1);
    keep[2] = 0;
    x[850] = NaN; // falls in segments 7 and 8 (step 100, length 200)
    const est = welch(x, { sampleRateHz: fs, segmentLength: 200, keep });
    expect(est.layout.count).toBe(9);
    expect(est.used).toBe(6);
  });

  it('rejects a selection of the wrong length', () => {
    expect(() => welch(new Float64Array(1000), { sampleRateHz: 100, segmentLength: 200, keep: new Uint8Array(3) })).toThrow(
      /9 segments/,
    );
  });
});
