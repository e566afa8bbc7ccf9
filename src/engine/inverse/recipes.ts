/**
 * Serialisable descriptions of a least-squares problem, rebuilt into the
 * same problem in the main thread and in each pool worker.
 */
import type { LeastSquaresProblem } from '@/src/engine/optim/types';
import { curveProblem, type CurveRecipe } from './curve-problem';
import { prepareSpectrum, type SpectrumInversionInput } from './spectrum-setup';

export type ProblemRecipe = { kind: 'spectrum'; input: SpectrumInversionInput } | { kind: 'curve'; curve: CurveRecipe };

export function buildProblem(recipe: ProblemRecipe): LeastSquaresProblem {
  return recipe.kind === 'spectrum' ? prepareSpectrum(recipe.input).problem : curveProblem(recipe.curve);
}
