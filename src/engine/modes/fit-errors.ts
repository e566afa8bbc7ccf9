/**
 * Errors of a two-stage Lorentzian fit's parameters propagated from the
 * scatter of the fitted bins (bin-scatter.ts) through the fit itself:
 * G = dq/dy by implicit differentiation of both weighted passes
 * (fit-sensitivity.ts), cov(q) = G V G^T.
 *
 * Why not the fit's own covariance (J^T W J)^-1: that form assumes the model
 * describes the spectrum (residuals pure noise) and fixed weights. Spectra
 * of the Earth-ionosphere cavity are not sums of Lorentzians, so the
 * residuals carry a systematic part, and the weights of both passes move
 * with the data. Measured (seeded Monte Carlo, chi-square(2K) bins, K = 50,
 * forward-model spectra of four invented stations, 36 quantities, robust
 * scatter of 100 draws): the covariance's errors were 0.16–1.20 of the Monte
 * Carlo scatter (median 0.63); propagating with the Gauss–Newton Hessian
 * and fixed weights 0.76 (the bins' own variance y^2/K instead of the
 * model's); adding the data-dependent weights alone 0.81; the full Hessian
 * (residual curvature, sum W r d2L/dq2) with fixed weights 0.97; everything
 * 0.98 (0.53–1.29). So the residual curvature of a non-Lorentzian spectrum is
 * most of it, the moving weights the rest. On exact Lorentzian spectra the
 * covariance was within 10 % at K = 200; at K = 10 both fall short where a
 * few draws jump to another local minimum (first-order propagation cannot see
 * those). Neighbouring bins of a Hann-tapered Welch spectrum are correlated
 * (bin-scatter.ts); taking them as independent gave 0.62–0.82 of the Monte
 * Carlo scatter on the pipeline's spectra.
 */
import { propagateBinScatter, type BinScatter } from './bin-scatter';
import { fitSensitivity, type FitSensitivityInput } from './fit-sensitivity';
import { paramCount } from './types';

/**
 * Covariance (np x np, row-major, in the fit's units) of the final parameters, the bins `input.data`
 * scattering as `scatter` says; `index` gives the bins' places on the spectrum's grid (for the bin correlation).
 * Parameters the fit holds on a bound get zero rows (they do not move with the data).
 */
export function propagatedFitCovariance(
  input: FitSensitivityInput,
  scatter: BinScatter,
  index?: ArrayLike<number>,
): Float64Array {
  const g = fitSensitivity(input, null, input.freqs.length);
  return propagateBinScatter(g, paramCount(input.modes), input.data, scatter, index);
}
