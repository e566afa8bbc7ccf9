/**
 * Test helper: least-squares fit of y(x) with a named closed-form model, as a
 * problem for the multi-start (which knows nothing of what a problem models). Models:
 *  - 'exp-rise':   y = b1 (1 - exp(-b2 x))
 *  - 'rational-2': y = b1 (x^2 + b2 x) / (x^2 + b3 x + b4)
 *  - 'rational-3': y = (b1 + b2 x + b3 x^2 + b4 x^3) / (1 + b5 x + b6 x^2 + b7 x^3)
 */
import type { LeastSquaresProblem } from '@/src/engine/optim/types';
import { InversionInputError } from '@/src/engine/inverse/errors';

export type CurveModel = 'exp-rise' | 'rational-2' | 'rational-3';
export const CURVE_MODEL_PARAMS: Record<CurveModel, number> = { 'exp-rise': 2, 'rational-2': 4, 'rational-3': 7 };

export interface CurveRecipe {
  model: CurveModel;
  x: number[];
  y: number[];
  sigma?: number[];
  lower?: number[];
  upper?: number[];
}

function valueAndGradient(model: CurveModel, b: Float64Array, x: number, g: Float64Array, row: number): number {
  if (model === 'exp-rise') {
    const e = Math.exp(-b[1] * x);
    g[row] = 1 - e;
    g[row + 1] = b[0] * x * e;
    return b[0] * (1 - e);
  }
  if (model === 'rational-2') {
    const num = x * x + x * b[1];
    const den = x * x + x * b[2] + b[3];
    g[row] = num / den;
    g[row + 1] = (b[0] * x) / den;
    g[row + 2] = (-b[0] * num * x) / (den * den);
    g[row + 3] = (-b[0] * num) / (den * den);
    return (b[0] * num) / den;
  }
  const pw = [1, x, x * x, x * x * x];
  const num = b[0] + b[1] * pw[1] + b[2] * pw[2] + b[3] * pw[3];
  const den = 1 + b[4] * pw[1] + b[5] * pw[2] + b[6] * pw[3];
  for (let k = 0; k < 4; k++) g[row + k] = pw[k] / den;
  for (let k = 1; k < 4; k++) g[row + 3 + k] = (-num * pw[k]) / (den * den);
  return num / den;
}

export function curveProblem(recipe: CurveRecipe): LeastSquaresProblem {
  const n = CURVE_MODEL_PARAMS[recipe.model];
  if (!n) throw new InversionInputError(`unknown curve model "${recipe.model}"`);
  const { x, y } = recipe;
  if (x.length === 0 || x.length !== y.length)
    throw new InversionInputError(`curve data: ${x.length} x values and ${y.length} y values`);
  if (x.length < n) throw new InversionInputError(`more parameters (${n}) than data (${x.length})`);
  const inv = Float64Array.from(x, (_, i) => 1 / (recipe.sigma?.[i] ?? 1));
  const g = new Float64Array(n);
  return {
    nParams: n,
    nResiduals: x.length,
    lower: recipe.lower ? Float64Array.from(recipe.lower) : undefined,
    upper: recipe.upper ? Float64Array.from(recipe.upper) : undefined,
    residuals(p, out) {
      for (let i = 0; i < x.length; i++) out[i] = (valueAndGradient(recipe.model, p, x[i], g, 0) - y[i]) * inv[i];
    },
    jacobian(p, out) {
      for (let i = 0; i < x.length; i++) {
        valueAndGradient(recipe.model, p, x[i], out, i * n);
        for (let j = 0; j < n; j++) out[i * n + j] *= inv[i];
      }
    },
  };
}
