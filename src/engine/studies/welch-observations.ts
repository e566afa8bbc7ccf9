/**
 * Observed spectra as a station would record them: for each true spectrum
 * (station, component, power on a band grid) a raw Gaussian time series with
 * that PSD (signal/synthetic-series.ts; ln power interpolated linearly
 * between the grid's frequencies) is drawn, and the pipeline's own Welch
 * estimate (Hann, 50 % overlap) taken of it; the bins on the band grid are
 * kept, with the estimate's Welch statistics. Used by recovery studies and by
 * the statistical self-checks.
 */
import type { Component } from '@/src/engine/components';
import type { ObservedSeries } from '@/src/engine/inverse/types';
import { mulberry32 } from '@/src/engine/random';
import { gaussianSeriesWithSpectrum, logLinearSpectrum } from '@/src/engine/signal/synthetic-series';
import { welch, welchStatisticsOf } from '@/src/engine/signal/welch';

export interface RawRecording {
  sampleRateHz: number;
  /** Samples per series (a power of two is fastest). */
  samples: number;
  /** Welch segment length in samples. */
  segmentLength: number;
  /** Samples shared by neighbouring segments (default half a segment, the pipeline's). */
  overlapLength?: number;
}

export interface TrueSpectrum {
  station: string;
  component: Component;
  frequencies: ArrayLike<number>;
  power: ArrayLike<number>;
}

/** One noise realisation of every spectrum (seeded; series drawn in order). */
export function welchObservations(truth: readonly TrueSpectrum[], rec: RawRecording, seed: number): ObservedSeries[] {
  const df = rec.sampleRateHz / rec.segmentLength;
  const rand = mulberry32(seed);
  return truth.map((t) => {
    const x = gaussianSeriesWithSpectrum(logLinearSpectrum(t.frequencies, t.power), rec.samples, rec.sampleRateHz, rand);
    const est = welch(x, { sampleRateHz: rec.sampleRateHz, segmentLength: rec.segmentLength, overlapLength: rec.overlapLength });
    const power = Array.from(t.frequencies, (f) => {
      const k = Math.round(f / df);
      if (Math.abs(k * df - f) > 1e-9 * f || k >= est.power.length)
        throw new RangeError(
          `${t.station} ${t.component}: ${f} Hz is not a bin of ${df} Hz Welch spectra below the Nyquist frequency`,
        );
      return est.power[k];
    });
    return {
      station: t.station,
      component: t.component,
      frequencies: Array.from(t.frequencies),
      power,
      welch: welchStatisticsOf(est),
    };
  });
}
