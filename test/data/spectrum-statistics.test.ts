/** Stored spectrum statistics: made per kind of spectrum, refused when missing or contradictory, handed to the inverter. */
import { describe, expect, it } from 'vitest';
import {
  assumedStatistics,
  logNormalStatistics,
  measuredStatistics,
  seriesScatterOf,
  statisticsProblem,
} from '@/src/data/spectrum-statistics';

const welch = (segments: number, effectiveAverages: number) =>
  measuredStatistics({ segments, window: 'hann', overlap: 0.5, effectiveAverages });

describe('spectrum statistics', () => {
  it('assumes for a spectrum file the 10-s Hann segments at 50 % overlap over its duration', () => {
    const s = assumedStatistics(600);
    if (s.basis !== 'assumed') throw new Error('expected assumed statistics');
    // 119 segments of 10 s at 5 s steps in 600 s; K_eff = K / (1 + 2 (1 - 1/K) / 36), rho = 1/6 for Hann at
    // 50 % overlap (Welch 1967; Harris 1978)
    expect(s.welch.segments).toBe(119);
    expect(s.welch.effectiveAverages).toBeCloseTo(119 / (1 + (2 * (1 - 1 / 119)) / 36), 10);
    expect(statisticsProblem(s)).toBeNull();
  });

  it('refuses missing, contradictory and too few statistics, naming the field', () => {
    expect(statisticsProblem(null)).toMatch(/^statistics: none recorded/);
    expect(statisticsProblem(welch(20, 25))).toMatch(/^statistics\.welch\.effectiveAverages: 25 exceeds the 20 segments/);
    expect(statisticsProblem(welch(3, 2.9))).toMatch(/^statistics\.welch\.segments: at least 4/);
    expect(statisticsProblem(welch(20, 0))).toMatch(/^statistics\.welch\.effectiveAverages: must be a positive number/);
    expect(statisticsProblem(logNormalStatistics(-0.1))).toMatch(/^statistics\.sigmaLog: must be a positive number/);
    expect(statisticsProblem(welch(20, 19))).toBeNull();
  });

  it('gives the inverter the Welch statistics with sigma = sqrt(trigamma(K_eff)), or the stated sigma', () => {
    // trigamma(10) = 0.10516633568168576 (scipy.special.polygamma(1, 10), printed by python3 with scipy 1.17.1)
    const s = seriesScatterOf(welch(12, 10));
    expect(s.welch?.effectiveAverages).toBe(10);
    expect(s.sigmaLog).toBeCloseTo(Math.sqrt(0.10516633568168575), 10);
    expect(seriesScatterOf(logNormalStatistics(0.1))).toEqual({ sigmaLog: 0.1 });
  });
});
