/** Defaults of the per-interval processing, resolved and checked in one place. */
import { checkCalibration, type Calibration } from '@/src/engine/signal/calibration';
import { resolveTransientOptions, type TransientOptions } from '@/src/engine/signal/transients';
import { MAX_MODES, MIN_MODES } from '@/src/engine/modes/usual-modes';
import {
  CLIPPING_SHARE_LIMIT,
  DEFAULT_MODE_COUNT,
  SIGNAL_SEGMENT_SECONDS,
  SPECTRUM_BAND_MAX_HZ,
  SPECTRUM_BAND_MIN_HZ,
} from '@/src/engine/tolerances';
import type { ProcessingConfig } from './types';

export interface ResolvedProcessingConfig {
  sampleRateHz: number;
  segmentLength: number;
  mainsHz: number | null;
  interferenceLines: { frequencyHz: number; halfWidthHz?: number }[];
  calibration: Calibration;
  band: { minHz: number; maxHz: number };
  modes: number;
  fullScale: number | null;
  clippingLimit: number;
  transient: TransientOptions;
}

export class ProcessingConfigError extends Error {}

export function resolveProcessingConfig(config: ProcessingConfig): ResolvedProcessingConfig {
  const fs = config.sampleRateHz;
  if (!(fs > 0) || !Number.isFinite(fs)) throw new ProcessingConfigError(`sampleRateHz must be a positive number, got ${fs}`);
  const segmentSeconds = config.segmentSeconds ?? SIGNAL_SEGMENT_SECONDS;
  const exact = segmentSeconds * fs;
  const segmentLength = Math.round(exact);
  if (!(segmentLength >= 2) || Math.abs(exact - segmentLength) > 1e-9 * exact) {
    throw new ProcessingConfigError(`segmentSeconds ${segmentSeconds} at ${fs} Hz is not a whole number (>= 2) of samples`);
  }
  const band = config.band ?? { minHz: SPECTRUM_BAND_MIN_HZ, maxHz: Math.min(SPECTRUM_BAND_MAX_HZ, fs / 2) };
  if (!(band.minHz >= 0 && band.maxHz > band.minHz && band.maxHz <= fs / 2)) {
    throw new ProcessingConfigError(
      `band ${band.minHz}–${band.maxHz} Hz must lie within 0–${fs / 2} Hz (Nyquist) and not be empty`,
    );
  }
  const modes = config.modes ?? DEFAULT_MODE_COUNT;
  if (modes !== 0 && !(Number.isInteger(modes) && modes >= MIN_MODES && modes <= MAX_MODES)) {
    throw new ProcessingConfigError(`modes must be 0 (no fit) or a whole number from ${MIN_MODES} to ${MAX_MODES}, got ${modes}`);
  }
  const mainsHz = config.mainsHz ?? null;
  if (mainsHz !== null && !(mainsHz > 0)) throw new ProcessingConfigError(`mainsHz must be positive, got ${mainsHz}`);
  const calibration = config.calibration ?? { kind: 'gain', gain: 1 };
  checkCalibration(calibration);
  const interferenceLines = config.interferenceLines ?? [];
  interferenceLines.forEach((l, i) => {
    if (!(l.frequencyHz > 0) || !Number.isFinite(l.frequencyHz))
      throw new ProcessingConfigError(`interference line ${i + 1}: frequencyHz must be a positive number, got ${l.frequencyHz}`);
    if (l.halfWidthHz !== undefined && !(l.halfWidthHz > 0))
      throw new ProcessingConfigError(`interference line ${i + 1}: halfWidthHz must be positive, got ${l.halfWidthHz}`);
  });
  const fullScale = config.fullScale ?? null;
  if (fullScale !== null && !(fullScale > 0)) throw new ProcessingConfigError(`fullScale must be positive, got ${fullScale}`);
  return {
    sampleRateHz: fs,
    segmentLength,
    mainsHz,
    interferenceLines,
    calibration,
    band,
    modes,
    fullScale,
    clippingLimit: CLIPPING_SHARE_LIMIT,
    transient: resolveTransientOptions(config.transient),
  };
}
