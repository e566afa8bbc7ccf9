/**
 * Real digamma psi(x) and trigamma psi1(x) = d psi / dx for x > 0, the mean
 * and variance of ln of a Gamma(x, 1) variable (the log of a Welch estimate,
 * stats/log-power.ts).
 * Trigamma: recurrence psi1(x) = psi1(x + 1) + 1/x^2 (A&S 6.4.6) up to
 * x >= TRIGAMMA_ASYMPTOTIC_MIN, then the asymptotic series
 * psi1(x) ~ 1/x + 1/(2x^2) + sum_k B_2k / x^(2k+1) (A&S 6.4.12).
 */
import { TRIGAMMA_ASYMPTOTIC_MIN } from '../tolerances';
import { digammaInto } from './digamma';

/** Bernoulli numbers B_2k for k = 1..7 (A&S Table 23.2). */
const B2K = [1 / 6, -1 / 30, 1 / 42, -1 / 30, 5 / 66, -691 / 2730, 7 / 6];

const out = [0, 0];

/** psi(x) for real x > 0. */
export function digammaReal(x: number): number {
  if (!(x > 0) || !Number.isFinite(x)) throw new RangeError(`digamma: x must be a positive finite number, got ${x}`);
  digammaInto(x, 0, out);
  return out[0];
}

/** psi1(x) for real x > 0. */
export function trigamma(x: number): number {
  if (!(x > 0) || !Number.isFinite(x)) throw new RangeError(`trigamma: x must be a positive finite number, got ${x}`);
  let acc = 0;
  while (x < TRIGAMMA_ASYMPTOTIC_MIN) {
    acc += 1 / (x * x);
    x += 1;
  }
  const i2 = 1 / (x * x);
  let s = 0;
  for (let k = B2K.length - 1; k >= 0; k--) s = (s + B2K[k]) * i2;
  return acc + 1 / x + 0.5 * i2 + s / x;
}
