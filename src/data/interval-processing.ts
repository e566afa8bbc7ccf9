/**
 * One raw interval of a station (samples, or a spectrum already computed) to
 * the row the database keeps: the engine's per-interval processing for
 * samples (calibration, Welch, transient rejection, line suppression, mode
 * fit, quality flags); the mode fit alone for spectra. Station settings
 * (mains, interference lines, calibration) come from the registry.
 */
import { processInterval } from '@/src/engine/pipeline/process-interval';
import type { ProcessingConfig } from '@/src/engine/pipeline/types';
import { calibrateSpectrum, type Calibration } from '@/src/engine/signal/calibration';
import { fitModes, ModeFitError } from '@/src/engine/modes/fit-modes';
import { welchScatter } from '@/src/engine/modes/bin-scatter';
import type { ModeFit } from '@/src/engine/modes/types';
import { ModeFitOptionError } from '@/src/engine/modes/options';
import {
  SIGNAL_INTERVAL_SECONDS,
  SIGNAL_SEGMENT_SECONDS,
  SPECTRUM_BAND_MAX_HZ,
  MODE_FREQUENCY_WINDOW_HZ,
} from '@/src/engine/tolerances';
import { MIN_MODES, USUAL_MODE_FREQUENCIES_HZ } from '@/src/engine/modes/usual-modes';
import type { IntervalFit, IntervalResultInput } from '@/db/repo/intervals';
import type { Station } from '@/db/repo/stations';
import type { Component } from '@/src/engine/components';
import { assumedStatistics, measuredStatistics } from './spectrum-statistics';

export const INTERVAL_SECONDS = SIGNAL_INTERVAL_SECONDS;
/** Most modes fitted for stored intervals. */
export const STORED_MODE_COUNT = 5;

/** Modes to fit below a spectrum's top frequency: the usual modes whose search window fits, at most STORED_MODE_COUNT; 0 when fewer than three. */
export function modeCountBelow(topHz: number): number {
  const n = USUAL_MODE_FREQUENCIES_HZ.filter((f) => f + MODE_FREQUENCY_WINDOW_HZ < topHz).length;
  return n >= MIN_MODES ? Math.min(STORED_MODE_COUNT, n) : 0;
}

export type RawInterval = { component: Component; startsAt: Date; durationS: number } & (
  | {
      kind: 'samples';
      sampleRateHz: number;
      samples: Float64Array;
      /** Physical samples: multiply by this to reach SI (V/m, T); the station calibration is then skipped. */
      siFactor?: number;
    }
  | {
      kind: 'spectrum';
      frequencies: ArrayLike<number>;
      power: ArrayLike<number>;
      /** Physical power: multiply by this to reach SI ((V/m)^2/Hz, T^2/Hz); otherwise the calibration applies. */
      siFactor?: number;
    }
);

/** Units of samples that are already physical, as factors to SI. */
const SAMPLE_UNITS: Record<string, number> = {
  'V/m': 1,
  'mV/m': 1e-3,
  'uV/m': 1e-6,
  'µV/m': 1e-6,
  T: 1,
  nT: 1e-9,
  pT: 1e-12,
  fT: 1e-15,
};
/** Units of spectra that are already physical, as factors to SI. */
const SPECTRUM_UNITS: Record<string, number> = {
  '(V/m)^2/Hz': 1,
  '(mV/m)^2/Hz': 1e-6,
  'T^2/Hz': 1,
  'nT^2/Hz': 1e-18,
  'pT^2/Hz': 1e-24,
  'fT^2/Hz': 1e-30,
};
export const sampleUnitFactor = (unit: string): number | undefined => SAMPLE_UNITS[unit.trim()];
export const spectrumUnitFactor = (unit: string): number | undefined => SPECTRUM_UNITS[unit.replace(/\s+/g, '')];

/** What the processing needs of a station: registered or about to be. */
type StationSettings = Pick<Station, 'code' | 'mainsHz' | 'interferenceLines' | 'components'>;

function calibrationOf(station: StationSettings, component: Component): Calibration {
  const c = station.components.find((x) => x.component === component);
  if (!c) throw new Error(`${station.code} has no ${component} component installed`);
  return c.calibration;
}

/** Processing settings of one station component (samples in physical units when siFactor is given). */
export function processingConfigFor(
  station: StationSettings,
  component: Component,
  sampleRateHz: number,
  siFactor?: number,
): ProcessingConfig {
  return {
    sampleRateHz,
    segmentSeconds: SIGNAL_SEGMENT_SECONDS,
    mainsHz: station.mainsHz,
    interferenceLines: station.interferenceLines.map((l) => ({ frequencyHz: l.frequencyHz })),
    // physical units: raw = field / siFactor, i.e. a flat response of 1/siFactor per SI unit
    calibration: siFactor !== undefined ? { kind: 'gain', gain: 1 / siFactor } : calibrationOf(station, component),
    modes: modeCountBelow(Math.min(SPECTRUM_BAND_MAX_HZ, sampleRateHz / 2)),
  };
}

export type ProcessedRow = Omit<IntervalResultInput, 'uploadId' | 'origin'>;

/**
 * What is stored of a mode fit: the modes, background and misfit, with the band, the scatter its errors
 * assume and the frequency ranges it left out (the pipeline's bridged lines; none for spectra files).
 */
export function storedFit(f: ModeFit): IntervalFit {
  return {
    modes: f.modes,
    background: f.background,
    misfit: f.misfit,
    band: { ...f.band },
    excluded: f.excluded.map((r) => ({ minHz: r.minHz, maxHz: r.maxHz })),
    ...(f.averages !== undefined ? { averages: f.averages } : {}),
    ...(f.binCorrelation ? { binCorrelation: [...f.binCorrelation] } : {}),
  };
}

export function processRawInterval(station: Station, raw: RawInterval): ProcessedRow {
  const base = {
    networkId: station.networkId,
    stationId: station.id,
    component: raw.component,
    startsAt: raw.startsAt,
    durationS: raw.durationS,
  };
  if (raw.kind === 'samples') {
    const r = processInterval(raw.samples, processingConfigFor(station, raw.component, raw.sampleRateHz, raw.siFactor));
    return {
      ...base,
      rejectedShare: r.rejectedShare,
      qualityFlags: r.flags,
      spectrum: r.spectrum
        ? { ...r.spectrum, segments: r.segments, statistics: r.welch ? measuredStatistics(r.welch) : null }
        : { frequencies: [], power: [], segments: 0, statistics: null },
      fit: r.fit ? storedFit(r.fit) : null,
    };
  }
  const power =
    raw.siFactor !== undefined
      ? Array.from(raw.power, (p) => p * raw.siFactor!)
      : Array.from(calibrateSpectrum(raw.frequencies, raw.power, calibrationOf(station, raw.component)).power);
  const frequencies = Array.from(raw.frequencies);
  // A file's spectrum carries no segment count: assume the usual 10-s Hann segments with 50 % overlap
  // (their equivalent averages and correlated neighbouring bins, as for the pipeline's own spectra).
  const statistics = assumedStatistics(raw.durationS);
  const segments = statistics.welch.segments;
  const scatter = welchScatter(statistics.welch);
  const flags: string[] = [];
  let fit = null;
  const modes = modeCountBelow(frequencies[frequencies.length - 1] ?? 0);
  if (modes === 0) flags.push('fit-failed');
  else
    try {
      const f = fitModes(frequencies, power, { modes, averages: scatter.averages, binCorrelation: scatter.lagCorrelation });
      fit = storedFit(f);
      flags.push(...f.flags);
    } catch (e) {
      if (!(e instanceof ModeFitError) && !(e instanceof ModeFitOptionError)) throw e;
      flags.push('fit-failed');
    }
  return { ...base, rejectedShare: 0, qualityFlags: flags, spectrum: { frequencies, power, segments, statistics }, fit };
}
