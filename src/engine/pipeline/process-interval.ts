/**
 * The per-interval processing the worker runs: samples of one interval for
 * one component -> transient screen -> Welch PSD of the kept segments ->
 * calibration -> line suppression -> band cut -> Lorentzian mode fit, with
 * quality flags. Pure: no I/O, no clocks.
 */
import { fitModes, ModeFitError } from '@/src/engine/modes/fit-modes';
import { ModeFitOptionError } from '@/src/engine/modes/options';
import { calibrateSpectrum, responseAt } from '@/src/engine/signal/calibration';
import { listedLines, mainsLines, suppressLines, type SpectralLine } from '@/src/engine/signal/line-suppression';
import { segmentLayout, segmentStats } from '@/src/engine/signal/segments';
import { screenTransients } from '@/src/engine/signal/transients';
import { welch, welchStatisticsOf } from '@/src/engine/signal/welch';
import { welchScatter } from '@/src/engine/modes/bin-scatter';
import { REJECTED_SHARE_LIMIT } from '@/src/engine/tolerances';
import { clippedShare, hasGaps } from './sample-checks';
import { resolveProcessingConfig } from './config';
import type { IntervalFlag, IntervalResult, ProcessingConfig } from './types';

export function processInterval(samples: Float64Array, config: ProcessingConfig): IntervalResult {
  const c = resolveProcessingConfig(config);
  const flags: IntervalFlag[] = [];
  if (hasGaps(samples)) flags.push('gaps');
  if (clippedShare(samples, c.fullScale) > c.clippingLimit) flags.push('clipping');

  const layout = segmentLayout(samples.length, c.segmentLength);
  const screen = screenTransients(segmentStats(samples, layout).variance, c.transient);
  const est = welch(samples, { sampleRateHz: c.sampleRateHz, segmentLength: c.segmentLength, keep: screen.keep });
  const rejectedShare = layout.count ? (layout.count - est.used) / layout.count : 1;
  if (rejectedShare > REJECTED_SHARE_LIMIT) flags.push('too-much-rejected');
  if (est.used === 0) {
    flags.push('no-data');
    return { spectrum: null, segments: 0, welch: null, rejectedShare, fit: null, flags };
  }

  const lo = est.frequencies.findIndex((f) => f >= c.band.minHz);
  let hi = est.frequencies.length - 1;
  while (hi > 0 && est.frequencies[hi] > c.band.maxHz) hi--;
  if (lo < 0 || hi < lo) throw new RangeError(`band ${c.band.minHz}–${c.band.maxHz} Hz holds no frequency of this spectrum`);
  const cal = calibrateSpectrum(est.frequencies, est.power, c.calibration);
  const lines: SpectralLine[] = [
    ...(c.mainsHz ? mainsLines(c.mainsHz, c.sampleRateHz / 2) : []),
    ...listedLines(c.interferenceLines),
  ];
  const clean = suppressLines(est.frequencies, cal.power, lines);
  const frequencies = Array.from(est.frequencies.subarray(lo, hi + 1));
  const power = Array.from(clean.power.subarray(lo, hi + 1));
  if (responseAt(c.calibration, frequencies).some((r) => r.outside)) flags.push('calibration-range');

  let fit = null;
  if (c.modes > 0) {
    try {
      // the Welch statistics of the segments actually averaged (K_eff and their bin correlation)
      const scatter = welchScatter(welchStatisticsOf(est));
      fit = fitModes(frequencies, power, {
        modes: c.modes,
        exclude: clean.suppressed.subarray(lo, hi + 1),
        averages: scatter.averages,
        binCorrelation: scatter.lagCorrelation,
      });
      for (const f of fit.flags) if (!flags.includes(f)) flags.push(f);
    } catch (e) {
      if (!(e instanceof ModeFitError) && !(e instanceof ModeFitOptionError)) throw e;
      flags.push('fit-failed');
    }
  }
  return { spectrum: { frequencies, power }, segments: est.used, welch: welchStatisticsOf(est), rejectedShare, fit, flags };
}
