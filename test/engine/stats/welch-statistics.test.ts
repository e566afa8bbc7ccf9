import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { digammaReal, trigamma } from '@/src/engine/special/polygamma';
import { logPowerBias, logPowerVariance } from '@/src/engine/stats/log-power';
import { hannWelchBinCorrelation } from '@/src/engine/stats/welch-bin-correlation';
import { hannEffectiveAverages, hannOverlapCorrelation, hannWelchStatistics } from '@/src/engine/stats/welch-statistics';

// Reference values: scipy.special digamma/polygamma and numpy computations (fixtures/welch-statistics/generate.py).
const fixture = JSON.parse(
  readFileSync(new URL('../../../fixtures/welch-statistics/welch-statistics.json', import.meta.url), 'utf8'),
) as {
  polygamma: { x: number; digamma: number; trigamma: number }[];
  overlap: { shift: number; rho: number }[];
  welch: { step: number; segmentLength: number; used: number[]; effectiveAverages: number; binCorrelation: number[] }[];
};

describe('digamma and trigamma of a real argument', () => {
  it('match scipy.special.digamma and polygamma(1, x)', () => {
    for (const r of fixture.polygamma) {
      expect(Math.abs(digammaReal(r.x) - r.digamma)).toBeLessThan(1e-14 * Math.max(1, Math.abs(r.digamma)));
      expect(Math.abs(trigamma(r.x) - r.trigamma) / r.trigamma).toBeLessThan(1e-14);
    }
  });

  it('psi1(1) = pi^2/6 (A&S 6.4.2) and psi1(x + 1) = psi1(x) - 1/x^2 (A&S 6.4.6)', () => {
    expect(trigamma(1)).toBeCloseTo(Math.PI ** 2 / 6, 15);
    for (const x of [0.3, 2.5, 11.5, 40]) expect(trigamma(x + 1)).toBeCloseTo(trigamma(x) - 1 / (x * x), 13);
  });

  it('refuses x <= 0', () => {
    expect(() => trigamma(0)).toThrow(/positive/);
    expect(() => digammaReal(-1)).toThrow(/positive/);
  });
});

describe('log of a Welch estimate', () => {
  it('bias psi(K) - ln K and variance psi1(K) from the scipy values', () => {
    for (const r of fixture.polygamma) {
      expect(logPowerBias(r.x)).toBeCloseTo(r.digamma - Math.log(r.x), 13);
      expect(logPowerVariance(r.x)).toBeCloseTo(r.trigamma, 13);
    }
  });

  it('approach -1/(2K) and 1/K for many averages (A&S 6.3.18, 6.4.12)', () => {
    expect(logPowerBias(1000) * 2000).toBeCloseTo(-1, 3);
    expect(logPowerVariance(1000) * 1000).toBeCloseTo(1, 2);
  });

  it('refuses a non-positive number of averages, naming it', () => {
    expect(() => logPowerBias(0)).toThrow(/effectiveAverages/);
  });
});

describe('Hann overlap correlation and K_eff', () => {
  it('matches the periodic Hann window summed by numpy', () => {
    for (const r of fixture.overlap) expect(hannOverlapCorrelation(r.shift)).toBeCloseTo(r.rho, 6);
    expect(hannOverlapCorrelation(0.5)).toBe(1 / 6);
    expect(hannOverlapCorrelation(1)).toBe(0);
  });

  it("K_eff equals Welch's formula for contiguous 50 % segments (Welch 1967, eq. 7)", () => {
    for (const k of [1, 2, 4, 12, 119]) expect(hannEffectiveAverages(k, 0.5)).toBeCloseTo(k / (1 + (2 * (1 - 1 / k)) / 36), 12);
    expect(hannEffectiveAverages(12, 0)).toBe(12);
    expect(hannEffectiveAverages([0, 1, 2, 3], 0.5)).toBeCloseTo(hannEffectiveAverages(4, 0.5), 12);
  });

  it('K_eff and the bin correlation match the exact moments of a Welch average (numpy)', () => {
    for (const r of fixture.welch) {
      const overlap = 1 - r.step / r.segmentLength;
      const contiguous = r.used.every((u, i) => u === i);
      const k = contiguous ? r.used.length : r.used;
      // the numpy moments include mean removal and the mirror term at a finite bin: agreement to a few parts in 1e3
      expect(Math.abs(hannEffectiveAverages(k, overlap) / r.effectiveAverages - 1)).toBeLessThan(3e-3);
      const c = hannWelchBinCorrelation(k, overlap, r.segmentLength);
      expect(Math.abs(c[0] - r.binCorrelation[0])).toBeLessThan(2e-3);
      expect(Math.abs(c[1] - r.binCorrelation[1])).toBeLessThan(2e-3);
    }
  });

  it('the bin correlation hardly depends on the window length', () => {
    const a = hannWelchBinCorrelation(12, 0.5, 128);
    const b = hannWelchBinCorrelation(12, 0.5);
    expect(Math.abs(a[0] - b[0])).toBeLessThan(1e-4);
    expect(Math.abs(a[1] - b[1])).toBeLessThan(1e-4);
  });

  it('statistics object and bad input', () => {
    expect(hannWelchStatistics(119, 0.5)).toEqual({
      segments: 119,
      window: 'hann',
      overlap: 0.5,
      effectiveAverages: hannEffectiveAverages(119, 0.5),
    });
    expect(() => hannEffectiveAverages(0, 0.5)).toThrow(/segments/);
    expect(() => hannEffectiveAverages(3, 1)).toThrow(/overlap/);
  });
});
