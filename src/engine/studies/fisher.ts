/**
 * Linearised uncertainty at a point: the Fisher information F = J^T W J of the
 * log-power misfit (W = 1/sigma^2 per bin, or the whitened form for the
 * correlated bins of Welch spectra, so J here is already W^1/2 J) and the
 * standard errors of F^-1 in physical units (Tarantola 2005, Inverse Problem
 * Theory, SIAM, §3.2: the linearised posterior covariance without prior).
 * Rows add, so the information of a network with a candidate station is the
 * network's plus the candidate's own J_c^T W_c J_c.
 */
import { prepareSpectrum, type SpectrumInversionInput } from '@/src/engine/inverse/interval-problem';
import { namedStdErrors } from '@/src/engine/inverse/named-errors';
import { physicalParams, type Parameterisation } from '@/src/engine/inverse/parameters';
import { covarianceFromJtJ } from '@/src/engine/optim/covariance';
import { accumulateNormalEquations } from '@/src/engine/optim/normal-equations';
import type { RegionErrors } from './types';

/** J^T W J (n x n, row-major) of the series of `input` at the internal point p. */
export function fisherInformation(input: SpectrumInversionInput, p: Float64Array): Float64Array {
  const { problem } = prepareSpectrum(input);
  const m = problem.nResiduals;
  const n = problem.nParams;
  const jac = new Float64Array(m * n);
  problem.jacobian(p, jac);
  const jtj = new Float64Array(n * n);
  accumulateNormalEquations(jac, new Float64Array(m), m, n, jtj, new Float64Array(n));
  return jtj;
}

/** Standard errors (physical units, per region) of the covariance F^-1 at p. */
export function errorsOfInformation(par: Parameterisation, p: Float64Array, information: Float64Array): RegionErrors {
  const cov = covarianceFromJtJ(information, par.slots.length);
  return namedStdErrors(par, physicalParams(par, p), cov.stdErrors);
}
