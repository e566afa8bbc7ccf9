/**
 * Serialisable descriptions of a least-squares problem, rebuilt into the
 * same problem in the main thread and in each pool worker.
 */
import type { LeastSquaresProblem } from '@/src/engine/optim/types';
import { curveProblem, type CurveRecipe } from './curve-problem';
import type { Parameterisation } from './parameters';
import { prepareModes, prepareSpectrum, type ModeInversionInput, type SpectrumInversionInput } from './spectrum-setup';

export type ProblemRecipe =
  | { kind: 'spectrum'; input: SpectrumInversionInput }
  | { kind: 'modes'; input: ModeInversionInput }
  | { kind: 'curve'; curve: CurveRecipe };

export interface PreparedRecipe {
  problem: LeastSquaresProblem;
  /** Region parameterisation (absent for plain curve fits). */
  par?: Parameterisation;
  nData: number;
}

export function prepareRecipe(recipe: ProblemRecipe): PreparedRecipe {
  if (recipe.kind === 'spectrum') {
    const p = prepareSpectrum(recipe.input);
    return { problem: p.problem, par: p.par, nData: p.layout.nData };
  }
  if (recipe.kind === 'modes') {
    const p = prepareModes(recipe.input);
    return { problem: p.problem, par: p.par, nData: p.problem.nData };
  }
  const problem = curveProblem(recipe.curve);
  return { problem, nData: problem.nResiduals };
}

export function buildProblem(recipe: ProblemRecipe): LeastSquaresProblem {
  return prepareRecipe(recipe).problem;
}
