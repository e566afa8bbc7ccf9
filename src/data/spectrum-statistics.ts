/**
 * What a stored spectrum knows of its own scatter (db/schema/stations.ts
 * SpectrumStatistics), made once per kind of spectrum, checked before a run
 * uses it, and turned into what the inverter takes: the Welch statistics
 * (sigma from K_eff, log bias removed, neighbouring bins correlated; Welch
 * 1967, IEEE Trans. Audio Electroacoust. 15, 70) or a stated sigma of ln P.
 */
import type { SpectrumStatistics } from '@/db/repo/intervals';
import type { WelchStatistics } from '@/src/engine/stats/welch-statistics';
import { hannWelchStatistics, welchStatisticsProblem } from '@/src/engine/stats/welch-statistics';
import { SIGNAL_SEGMENT_SECONDS } from '@/src/engine/tolerances';
import { logPowerVariance } from '@/src/engine/stats/log-power';

/** Overlap of the pipeline's Welch segments (segments.ts: half a segment). */
export const PIPELINE_OVERLAP = 0.5;

export function measuredStatistics(welch: WelchStatistics): SpectrumStatistics {
  return { basis: 'measured', welch: { ...welch } };
}

/** A spectrum file's: the pipeline's 10-s Hann segments at 50 % overlap over the interval, contiguous (assumed). */
export function assumedStatistics(durationS: number): Exclude<SpectrumStatistics, { basis: 'log-normal' }> {
  const segments = Math.max(1, Math.floor((2 * durationS) / SIGNAL_SEGMENT_SECONDS) - 1);
  return { basis: 'assumed', welch: hannWelchStatistics(segments, PIPELINE_OVERLAP) };
}

/** Synthetic spectra whose ln P scatters independently by sigmaLog per bin. */
export function logNormalStatistics(sigmaLog: number): SpectrumStatistics {
  return { basis: 'log-normal', sigmaLog };
}

/** What is wrong with a stored spectrum's statistics, as `field: problem`; null when they can be used. */
export function statisticsProblem(s: SpectrumStatistics | null | undefined): string | null {
  if (!s) return 'statistics: none recorded for this spectrum (nothing says how much its bins scatter)';
  if (s.basis === 'log-normal')
    return s.sigmaLog > 0 && Number.isFinite(s.sigmaLog)
      ? null
      : `statistics.sigmaLog: must be a positive number, got ${s.sigmaLog}`;
  const p = welchStatisticsProblem(s.welch);
  return p ? `statistics.welch.${p}` : null;
}

/**
 * The scatter the inverter takes for a series with these (checked) statistics: the Welch statistics (which win
 * in the inverter) with the sigma of ln P they imply, sqrt(trigamma(K_eff)); or the stated sigma.
 */
export function seriesScatterOf(s: SpectrumStatistics): { sigmaLog: number; welch?: WelchStatistics } {
  if (s.basis === 'log-normal') return { sigmaLog: s.sigmaLog };
  return { sigmaLog: Math.sqrt(logPowerVariance(s.welch.effectiveAverages)), welch: { ...s.welch } };
}
