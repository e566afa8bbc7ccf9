/** Options of a mode fit, with every default resolved in one place. */
import type { LmOptions } from '@/src/engine/optim/types';
import {
  MODE_FIT_MAX_ITERATIONS,
  MODE_FIT_MIN_HZ,
  MODE_FIT_MISFIT_REL_TOL,
  MODE_FIT_STEP_REL_TOL,
  MODE_FIT_TOP_MARGIN_HZ,
} from '@/src/engine/tolerances';
import { MAX_MODES, MIN_MODES, USUAL_MODE_FREQUENCIES_HZ } from './usual-modes';

export interface ModeFitOptions {
  /** Number of modes, 3–7; default: every usual mode the spectrum covers (at least 3). */
  modes: number;
  /** Fitted band; default from MODE_FIT_MIN_HZ to MODE_FIT_TOP_MARGIN_HZ past the highest mode's usual frequency. */
  minHz: number;
  maxHz: number;
  /** Equivalent number of independent averages behind each bin (bin-scatter.ts); absolute errors when given, else estimated from the misfit. */
  averages?: number;
  /** Correlation of two bins' power at grid distance 1, 2, ... (HANN_BIN_POWER_CORRELATION for the pipeline's Welch); default none. */
  binCorrelation?: readonly number[];
  /** Bins to leave out (1 = ignore), e.g. bins bridged by line suppression. */
  exclude?: Uint8Array;
  /** Starting frequencies, one per mode; default the usual mode frequencies. */
  guessHz: number[];
  /** Optimiser settings; defaults MODE_FIT_* tolerances. */
  lm: Partial<LmOptions>;
  shouldStop?: () => boolean;
}

export class ModeFitOptionError extends Error {}

export function resolveModeFitOptions(options: Partial<ModeFitOptions>, frequencies: ArrayLike<number>): ModeFitOptions {
  if (frequencies.length === 0) throw new ModeFitOptionError('the spectrum has no frequencies');
  const top = frequencies[frequencies.length - 1];
  let modes = options.modes ?? (options.guessHz ? options.guessHz.length : undefined);
  if (modes === undefined) {
    modes = USUAL_MODE_FREQUENCIES_HZ.filter((u) => u + 1 <= top).length;
    modes = Math.min(MAX_MODES, Math.max(MIN_MODES, modes));
  }
  if (!Number.isInteger(modes) || modes < MIN_MODES || modes > MAX_MODES) {
    throw new ModeFitOptionError(`modes must be a whole number from ${MIN_MODES} to ${MAX_MODES}, got ${modes}`);
  }
  const guessHz = options.guessHz ?? USUAL_MODE_FREQUENCIES_HZ.slice(0, modes);
  if (guessHz.length !== modes) throw new ModeFitOptionError(`guessHz has ${guessHz.length} values for ${modes} modes`);
  const minHz = options.minHz ?? Math.max(MODE_FIT_MIN_HZ, frequencies[0]);
  const maxHz = options.maxHz ?? Math.min(top, guessHz[modes - 1] + MODE_FIT_TOP_MARGIN_HZ);
  if (!(maxHz > minHz)) throw new ModeFitOptionError(`fit band is empty (minHz ${minHz}, maxHz ${maxHz})`);
  const averages = options.averages;
  if (averages !== undefined && !(averages > 0)) throw new ModeFitOptionError(`averages must be positive, got ${averages}`);
  const binCorrelation = options.binCorrelation;
  binCorrelation?.forEach((c, i) => {
    if (!(Math.abs(c) < 1)) throw new ModeFitOptionError(`binCorrelation[${i}] must lie between -1 and 1, got ${c}`);
  });
  const lm = {
    misfitTol: MODE_FIT_MISFIT_REL_TOL,
    stepTol: MODE_FIT_STEP_REL_TOL,
    maxIterations: MODE_FIT_MAX_ITERATIONS,
    ...options.lm,
  };
  return { ...options, modes, minHz, maxHz, averages, binCorrelation, guessHz: [...guessHz], lm };
}
