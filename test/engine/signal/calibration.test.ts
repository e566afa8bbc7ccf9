import { describe, expect, it } from 'vitest';
import { calibrateSpectrum, checkCalibration, responseAt, type Calibration } from '@/src/engine/signal/calibration';
import { welch } from '@/src/engine/signal/welch';
import { gaussian, mulberry32 } from '@/src/engine/random';

describe('calibration', () => {
  it('interpolates a tabulated first-order high-pass response', () => {
    // H(f) = (i f/fc) / (1 + i f/fc): |H| = x / sqrt(1 + x^2), arg H = 90 deg - atan(x) (RC high-pass, any circuits text).
    const fc = 2;
    const h = (f: number) => ({ amp: f / fc / Math.hypot(1, f / fc), ph: 90 - (Math.atan(f / fc) * 180) / Math.PI });
    const points = Array.from({ length: 200 }, (_, i) => {
      const f = 1 + i * 0.25;
      return { frequencyHz: f, amplitude: h(f).amp, phaseDeg: h(f).ph };
    });
    const cal: Calibration = { kind: 'response', points };
    const fq = [3.1, 7.83, 14.3, 20.8, 45.05];
    const r = responseAt(cal, fq);
    fq.forEach((f, i) => {
      expect(Math.abs(r[i].amplitude - h(f).amp)).toBeLessThan(1e-3);
      expect(Math.abs(r[i].phaseDeg - h(f).ph)).toBeLessThan(0.05);
      expect(r[i].re).toBeCloseTo(r[i].amplitude * Math.cos((r[i].phaseDeg * Math.PI) / 180), 12);
    });
  });

  it('interpolates phase across the +-180 degree wrap', () => {
    const cal: Calibration = {
      kind: 'response',
      points: [
        { frequencyHz: 1, amplitude: 1, phaseDeg: 170 },
        { frequencyHz: 2, amplitude: 3, phaseDeg: -170 },
      ],
    };
    const [mid] = responseAt(cal, [1.5]);
    expect(mid.phaseDeg).toBeCloseTo(180, 10);
    expect(mid.amplitude).toBeCloseTo(2, 12);
  });

  it('undoes a known filter on a Welch spectrum', () => {
    // y[n] = x[n] + a x[n-1] has H(f) = 1 + a exp(-2 pi i f / fs) (DFT shift theorem); P_y = |H|^2 P_x.
    const fs = 200;
    const a = 0.6;
    const rand = mulberry32(21);
    const x = Float64Array.from({ length: fs * 300 }, () => gaussian(rand));
    const y = x.map((v, j) => v + (j > 0 ? a * x[j - 1] : 0));
    const px = welch(x, { sampleRateHz: fs, segmentLength: 2000 });
    const py = welch(y, { sampleRateHz: fs, segmentLength: 2000 });
    const points = Array.from({ length: 101 }, (_, i) => {
      const f = i;
      const re = 1 + a * Math.cos((-2 * Math.PI * f) / fs);
      const im = a * Math.sin((-2 * Math.PI * f) / fs);
      return { frequencyHz: f, amplitude: Math.hypot(re, im), phaseDeg: (Math.atan2(im, re) * 180) / Math.PI };
    });
    const cal = calibrateSpectrum(py.frequencies, py.power, { kind: 'response', points });
    expect(cal.outside).toBe(0);
    const ratios = Array.from(cal.power.slice(1, -1), (v, k) => Math.abs(v / px.power[k + 1] - 1)).sort((p, q) => p - q);
    expect(ratios[Math.floor(ratios.length / 2)]).toBeLessThan(5e-3);
    const flat = calibrateSpectrum(py.frequencies, py.power, { kind: 'gain', gain: 4 });
    expect(flat.power[100]).toBeCloseTo(py.power[100] / 16, 15);
  });

  it('names the bad entry of a response table', () => {
    expect(() => checkCalibration({ kind: 'gain', gain: 0 })).toThrow(/gain/);
    expect(() =>
      checkCalibration({
        kind: 'response',
        points: [
          { frequencyHz: 1, amplitude: 1, phaseDeg: 0 },
          { frequencyHz: 1, amplitude: 1, phaseDeg: 0 },
        ],
      }),
    ).toThrow(/row 2/);
    expect(() =>
      checkCalibration({
        kind: 'response',
        points: [
          { frequencyHz: 1, amplitude: -1, phaseDeg: 0 },
          { frequencyHz: 2, amplitude: 1, phaseDeg: 0 },
        ],
      }),
    ).toThrow(/row 1: amplitude/);
  });
});
