import { describe, expect, it } from 'vitest';
import { processInterval } from '@/src/engine/pipeline/process-interval';
import { hannWelchBinCorrelation } from '@/src/engine/stats/welch-bin-correlation';
import { lorentzSum, seriesWithPsd, type TrueModes } from '@/test/engine/modes/synthetic';
import { gaussian, mulberry32 } from '@/src/engine/random';

const fs = 200;
const TRUE: TrueModes = {
  f: [7.88, 14.2, 20.45, 26.6, 32.8],
  a: [0.8, 0.55, 0.4, 0.28, 0.2],
  g: [0.9, 1.4, 1.8, 2.2, 2.5],
  b0: 0.1,
  b1: -1e-3,
};

/** Ten minutes in raw units: the field (PSD TRUE) times a gain of 2, plus 50 Hz mains, a 16.7 Hz line and one burst. */
function rawInterval(seed: number): Float64Array {
  const field = seriesWithPsd((f) => lorentzSum(TRUE, f), fs, 17, seed).subarray(0, 600 * fs);
  const rand = mulberry32(seed);
  return field.map((v, j) => {
    const t = j / fs;
    let x = 2 * v + 3 * Math.sin(2 * Math.PI * 49.98 * t) + 2 * Math.sin(2 * Math.PI * (50 / 3) * t + 0.5);
    if (j >= 30_000 && j < 30_300) x += 40 * gaussian(rand);
    return x;
  });
}

describe('per-interval processing', () => {
  const config = {
    sampleRateHz: fs,
    mainsHz: 50,
    interferenceLines: [{ frequencyHz: 50 / 3 }],
    calibration: { kind: 'gain' as const, gain: 2 },
  };

  it.each([101, 202])(
    'recovers the modes of a synthetic interval through rejection, calibration and line suppression (seed %i)',
    (seed) => {
      const r = processInterval(rawInterval(seed), config);
      expect(r.flags).toEqual([]);
      // 119 segments (Welch layout with step 1000); the burst at 150 s touches segments 29 and 30
      expect(r.segments).toBe(117);
      expect(r.rejectedShare).toBeCloseTo(2 / 119, 12);
      expect(r.spectrum!.frequencies[0]).toBeCloseTo(3, 12);
      expect(r.spectrum!.frequencies.at(-1)).toBeCloseTo(48, 12);
      // calibrated power follows the model again at the suppressed 16.7 Hz line (Timmer & König synthesis)
      const k = r.spectrum!.frequencies.findIndex((f) => Math.abs(f - 16.7) < 0.05);
      expect(Math.abs(Math.log(r.spectrum!.power[k] / lorentzSum(TRUE, 16.7)))).toBeLessThan(0.3);
      const fit = r.fit!;
      // the fit's errors assume the interval's own Welch statistics: K_eff of the 117 segments actually
      // averaged and the Hann bin correlation of that many segments
      expect(fit.averages).toBe(r.welch!.effectiveAverages);
      expect(fit.binCorrelation).toEqual([...hannWelchBinCorrelation(r.welch!.segments, r.welch!.overlap)]);
      fit.modes.forEach((m, n) => {
        expect(Math.abs(m.frequency - TRUE.f[n])).toBeLessThan(4 * m.errors.frequency);
        expect(Math.abs(m.halfWidth - TRUE.g[n])).toBeLessThan(4 * m.errors.halfWidth);
        expect(Math.abs(m.amplitude - TRUE.a[n])).toBeLessThan(4 * m.errors.amplitude);
      });
    },
  );

  it('flags gaps, clipping and intervals that are mostly rejected', () => {
    const gappy = rawInterval(5);
    gappy.fill(NaN, 0, 70_000);
    const g = processInterval(gappy, config);
    expect(g.flags).toContain('gaps');
    expect(g.flags).toContain('too-much-rejected');
    expect(g.rejectedShare).toBeCloseTo(70 / 119, 12); // segments 0..69 hold a missing sample
    const clipped = rawInterval(6).map((v) => Math.max(-4, Math.min(4, v)));
    expect(processInterval(clipped, config).flags).toContain('clipping');
    expect(processInterval(rawInterval(6), { ...config, fullScale: 4 }).flags).toContain('clipping');
    const empty = processInterval(new Float64Array(600 * fs).fill(NaN), config);
    expect(empty.flags).toEqual(['gaps', 'too-much-rejected', 'no-data']);
    expect(empty.spectrum).toBeNull();
  });

  it('flags a band outside the response table and a failed fit', () => {
    const table = {
      kind: 'response' as const,
      points: [
        { frequencyHz: 5, amplitude: 2, phaseDeg: 0 },
        { frequencyHz: 40, amplitude: 2, phaseDeg: 0 },
      ],
    };
    expect(processInterval(rawInterval(7), { ...config, calibration: table }).flags).toEqual(['calibration-range']);
    const silent = processInterval(new Float64Array(600 * fs), { sampleRateHz: fs });
    expect(silent.flags).toContain('fit-failed');
  });

  it('names bad settings', () => {
    const x = new Float64Array(4000);
    expect(() => processInterval(x, { sampleRateHz: fs, segmentSeconds: 0.001 })).toThrow(/segmentSeconds/);
    expect(() => processInterval(x, { sampleRateHz: fs, modes: 9 })).toThrow(/modes/);
    expect(() => processInterval(x, { sampleRateHz: fs, band: { minHz: 3, maxHz: 150 } })).toThrow(/Nyquist/);
    expect(() => processInterval(x, { sampleRateHz: fs, calibration: { kind: 'gain', gain: 0 } })).toThrow(/gain/);
    expect(() =>
      processInterval(x, { sampleRateHz: fs, interferenceLines: [{ frequencyHz: 16.7 }, { frequencyHz: -3 }] }),
    ).toThrow(/interference line 2/);
  });
});

describe('per-interval processing at a low sample rate', () => {
  it('reports a failed fit, not a crash, when the band cannot hold the modes asked for', () => {
    // 20 Hz sampling: Nyquist 10 Hz, so only the first mode is inside the band
    const rand = mulberry32(8);
    const x = Float64Array.from({ length: 600 * 20 }, () => gaussian(rand));
    const r = processInterval(x, { sampleRateHz: 20, modes: 5, band: { minHz: 3, maxHz: 10 } });
    expect(r.flags).toEqual(['fit-failed']);
    expect(r.fit).toBeNull();
    expect(r.spectrum!.frequencies.at(-1)).toBe(10);
  });
});
