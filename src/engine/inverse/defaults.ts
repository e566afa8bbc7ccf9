/**
 * The inversion's defaults, declared once: the command line, the run
 * configuration and the run launcher's form all start from these. A single
 * inversion (one case) spends more starts than each interval of a series,
 * where the previous interval's minima are carried over as warm starts.
 * Plain constants (no Node imports), so client forms can show them too.
 */
import { INVERSION_LM_MISFIT_TOL, INVERSION_LM_STEP_TOL, LM_INITIAL_DAMPING, LM_MAX_ITERATIONS } from '@/src/engine/tolerances';

export const INVERSION_DEFAULTS = Object.freeze({
  /** Starts of a single inversion. */
  starts: 64,
  /** Starts of each interval of a series (warm starts from the previous interval included). */
  seriesStarts: 16,
  /** Seed of the quasi-random start sequence. */
  seed: 1,
  /** Levenberg–Marquardt settings of each start. */
  lm: Object.freeze({
    initialDamping: LM_INITIAL_DAMPING,
    maxIterations: LM_MAX_ITERATIONS,
    misfitTol: INVERSION_LM_MISFIT_TOL,
    stepTol: INVERSION_LM_STEP_TOL,
  }),
  /** Quasi-random starts whose basin a better start nearby already leads into are not searched (clustering.ts). */
  cluster: true,
  /** Standard errors are not scaled by the reduced chi-square unless asked: the sigmas are trusted. */
  scaleErrors: false,
});
