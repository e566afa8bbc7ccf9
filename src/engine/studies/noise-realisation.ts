/**
 * One noise realisation of a study's noise-free spectra. With `sigmaLog`,
 * each bin's power is multiplied by exp(sigma e), e standard normal (log-normal
 * scatter of that sigma in ln power, unbiased in the log). With Welch
 * statistics, each series is what a station would record: a raw Gaussian
 * series with the true spectrum, Welch-averaged over the given number of
 * Hann segments at the given overlap (welch-observations.ts), so that the log
 * bias psi(K_eff) - ln K_eff and the correlation of neighbouring bins are
 * those of the pipeline's own spectra; the series then carry the statistics
 * of their estimate. The band's bins must then be bins of that estimate.
 */
import type { Band } from '@/src/engine/band';
import { InversionInputError } from '@/src/engine/inverse/errors';
import type { ObservedSeries } from '@/src/engine/inverse/types';
import { gaussian, mulberry32 } from '@/src/engine/random';
import type { WelchStatistics } from '@/src/engine/stats/welch-statistics';
import { RECOVERY_SAMPLE_RATE_OVER_TOP } from '@/src/engine/tolerances';
import { welchObservations, type RawRecording } from './welch-observations';
import type { StudyNoise } from './types';

/** The raw recording whose Welch estimate has the band's step as its bin width and the statistics' segments. */
export function welchRecording(band: Band, w: WelchStatistics): RawRecording {
  const ratio = band.minHz / band.stepHz;
  if (Math.abs(ratio - Math.round(ratio)) > 1e-9 * Math.max(1, ratio))
    throw new InversionInputError(
      `band.minHz: with Welch noise the band's bins are bins of a Welch spectrum, so minHz (${band.minHz}) must be a whole multiple of stepHz (${band.stepHz})`,
    );
  let segmentLength = 4;
  while (segmentLength * band.stepHz < RECOVERY_SAMPLE_RATE_OVER_TOP * band.maxHz) segmentLength *= 2;
  const overlapLength = Math.round(w.overlap * segmentLength);
  return {
    sampleRateHz: segmentLength * band.stepHz,
    segmentLength,
    overlapLength,
    samples: segmentLength + (w.segments - 1) * (segmentLength - overlapLength),
  };
}

/** Noisy copies of the noise-free `series` (seeded: the same seed gives the same spectra). */
export function noiseRealisation(
  series: readonly ObservedSeries[],
  noise: StudyNoise,
  band: Band,
  seed: number,
): ObservedSeries[] {
  if (noise.welch) return welchObservations(series, welchRecording(band, noise.welch), seed);
  const sigma = noise.sigmaLog!;
  const rand = mulberry32(seed);
  return series.map((s) => ({
    station: s.station,
    component: s.component,
    frequencies: s.frequencies,
    power: Float64Array.from(s.power, (p) => p * Math.exp(sigma * gaussian(rand))),
    sigmaLog: sigma,
  }));
}
