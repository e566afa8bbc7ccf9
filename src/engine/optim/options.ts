/** Defaults of the Levenberg–Marquardt optimiser, resolved in one place. */
import {
  LM_DAMPING_MAX,
  LM_DAMPING_MIN,
  LM_GRADIENT_TOL,
  LM_INITIAL_DAMPING,
  LM_MAX_EVALUATIONS,
  LM_MAX_ITERATIONS,
  LM_MISFIT_REL_TOL,
  LM_STEP_REL_TOL,
} from '@/src/engine/tolerances';
import type { LmOptions } from './types';
import { OptimInputError } from './errors';

export const DEFAULT_LM_OPTIONS: Readonly<LmOptions> = Object.freeze({
  misfitTol: LM_MISFIT_REL_TOL,
  stepTol: LM_STEP_REL_TOL,
  gradientTol: LM_GRADIENT_TOL,
  maxIterations: LM_MAX_ITERATIONS,
  maxEvaluations: LM_MAX_EVALUATIONS,
  initialDamping: LM_INITIAL_DAMPING,
  dampingMin: LM_DAMPING_MIN,
  dampingMax: LM_DAMPING_MAX,
});

/** Fill in defaults and check the values; throws OptimInputError naming the bad option. */
export function resolveLmOptions(options: Partial<LmOptions> = {}): LmOptions {
  const o: LmOptions = { ...DEFAULT_LM_OPTIONS };
  for (const key of Object.keys(options) as (keyof LmOptions)[]) {
    const v = options[key];
    if (v === undefined) continue;
    if (!(key in DEFAULT_LM_OPTIONS)) throw new OptimInputError(`unknown optimiser option "${key}"`);
    if (typeof v !== 'number' || !Number.isFinite(v) || v < 0) {
      throw new OptimInputError(`optimiser option "${key}" must be a finite number >= 0, got ${String(v)}`);
    }
    o[key] = v;
  }
  if (o.maxIterations < 1 || o.maxEvaluations < 1)
    throw new OptimInputError('maxIterations and maxEvaluations must be at least 1');
  if (o.dampingMin > o.dampingMax) throw new OptimInputError('dampingMin must not exceed dampingMax');
  return o;
}
