/**
 * One weighted least-squares fit of the Lorentzian model: residuals
 * r_i = (P(f_i) - d_i) / sigma_i minimised by the shared Levenberg–Marquardt
 * optimiser (which knows nothing of the model).
 */
import { levenbergMarquardt } from '@/src/engine/optim/levenberg-marquardt';
import type { LmOptions, LmResult } from '@/src/engine/optim/types';
import { lorentzianJacobian, lorentzianModel } from './lorentzian';
import { paramCount } from './types';

export interface WeightedFitInput {
  modes: number;
  freqs: Float64Array;
  data: Float64Array;
  sigma: Float64Array;
  start: Float64Array;
  lower?: Float64Array;
  upper?: Float64Array;
  lm?: Partial<LmOptions>;
  shouldStop?: () => boolean;
}

export function weightedLorentzianFit(input: WeightedFitInput): LmResult {
  const { modes, freqs, data, sigma } = input;
  const m = freqs.length;
  const model = new Float64Array(m);
  return levenbergMarquardt(
    {
      nParams: paramCount(modes),
      nResiduals: m,
      lower: input.lower,
      upper: input.upper,
      residuals(p, out) {
        lorentzianModel(p, modes, freqs, model);
        for (let i = 0; i < m; i++) out[i] = (model[i] - data[i]) / sigma[i];
      },
      jacobian(p, out) {
        lorentzianJacobian(p, modes, freqs, sigma, out);
      },
    },
    input.start,
    input.lm,
    { shouldStop: input.shouldStop },
  );
}
