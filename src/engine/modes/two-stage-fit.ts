/**
 * The two weighted passes of a Lorentzian mode fit, shared by the fit of an
 * observed spectrum (fit-modes.ts) and the fit of a predicted one (the mode
 * misfit), so that both go through one and the same estimator.
 *
 * Weighting by the data biases fits low (Neyman's chi-square), so the first
 * pass uses sigma = rel * data and the second sigma = rel * (first model),
 * Pearson's chi-square with fixed weights (Baker & Cousins 1984, Nucl.
 * Instrum. Methods 221, 437; common practice). The second pass is skipped
 * when the first model is not positive everywhere.
 */
import type { LmOptions, LmResult } from '@/src/engine/optim/types';
import { lorentzianModel } from './lorentzian';
import { newtonPolish } from './newton-polish';
import { weightedLorentzianFit } from './weighted-fit';

export interface TwoStageInput {
  modes: number;
  freqs: Float64Array;
  /** Powers of the fitted bins, normalised to order one. */
  data: Float64Array;
  /** Relative scatter per bin (1/sqrt(K)); scales chi-square only, not the optimum. */
  rel: number;
  start: Float64Array;
  lower: Float64Array;
  upper: Float64Array;
  lm?: Partial<LmOptions>;
  shouldStop?: () => boolean;
  /** Newton steps (full Hessian) after each pass's optimiser run, to take it to full precision (newton-polish.ts); default 0. */
  polish?: number;
}

export interface TwoStageResult {
  first: LmResult;
  final: LmResult;
  /** The first pass's model on the fitted bins (the second pass's sigma / rel), or null when the second pass was skipped. */
  firstModel: Float64Array | null;
}

export function twoStageLorentzianFit(input: TwoStageInput): TwoStageResult {
  const { modes, freqs, data, rel } = input;
  const common = { modes, freqs, data, lower: input.lower, upper: input.upper, lm: input.lm, shouldStop: input.shouldStop };
  const pass = (sigma: Float64Array, start: Float64Array): LmResult => {
    const r = weightedLorentzianFit({ ...common, sigma, start });
    if (!input.polish || !r.converged) return r;
    return {
      ...r,
      ...newtonPolish({ modes, freqs, data, sigma, lower: input.lower, upper: input.upper }, r.params, input.polish),
    };
  };
  const first = pass(
    data.map((v) => rel * v),
    input.start,
  );
  const model = new Float64Array(freqs.length);
  lorentzianModel(first.params, modes, freqs, model);
  if (!model.every((v) => v > 0 && Number.isFinite(v))) return { first, final: first, firstModel: null };
  const final = pass(
    model.map((v) => rel * v),
    first.params,
  );
  return { first, final, firstModel: model };
}
