/**
 * The log of a Welch estimate. With P_hat = P X / K_eff, X ~ Gamma(K_eff, 1)
 * (chi-square with 2 K_eff degrees of freedom, halved; welch-statistics.ts),
 *   E[ln P_hat] - ln P = psi(K_eff) - ln K_eff   (about -1/(2 K_eff)),
 *   var(ln P_hat)      = psi1(K_eff)             (about 1/K_eff),
 * the mean and variance of the log of a Gamma variable (Johnson, Kotz &
 * Balakrishnan, Continuous Univariate Distributions 1, ch. 17, from memory).
 * A log-power misfit must add the bias back to the observed logs.
 */
import { digammaReal, trigamma } from '@/src/engine/special/polygamma';

function check(k: number): void {
  if (!(k > 0) || !Number.isFinite(k)) throw new RangeError(`effectiveAverages must be a positive number, got ${k}`);
}

/** Mean offset of ln P_hat below ln P: psi(K_eff) - ln K_eff (negative). */
export function logPowerBias(effectiveAverages: number): number {
  check(effectiveAverages);
  return digammaReal(effectiveAverages) - Math.log(effectiveAverages);
}

/** Variance of ln P_hat: psi1(K_eff). */
export function logPowerVariance(effectiveAverages: number): number {
  check(effectiveAverages);
  return trigamma(effectiveAverages);
}
