/**
 * Legendre function of complex degree nu on the cut, as the cavity needs it:
 * X(theta) = P_nu(-cos theta) = 2F1(-nu, nu + 1; 1; z), z = (1 + cos theta)/2 = cos^2(theta/2),
 * with its theta-derivatives, and Q(theta) = (dX/dtheta) / sin theta (regular at the antipode).
 *
 * - z <= 1/2 (theta >= 90 deg): the Gauss series in z and its term-wise z-derivatives.
 * - z > 1/2: Abramowitz & Stegun 15.3.10 (c = a + b, logarithmic case) in w = 1 - z = sin^2(theta/2):
 *     F = K sum_n c_n (d_n - ln w) w^n,   K = 1/(Gamma(a) Gamma(b)) = -sin(pi nu)/pi,
 *     c_n = (a)_n (b)_n / (n!)^2,  d_n = 2 psi(n+1) - psi(a+n) - psi(b+n),
 *   and its term-wise w-derivative (a convergent power-log series, differentiated term by term),
 *   dw/dtheta = sin(theta)/2. Higher derivatives there come from the Legendre equation
 *   X'' + cot(theta) X' + nu(nu+1) X = 0.
 * Coefficients obey c_{n+1} = c_n (n(n+1) - nu(nu+1)) / (n+1)^2 since (a+n)(b+n) = n(n+1) - nu(nu+1).
 * psi(a) = psi(-nu) = psi(1 + nu) + pi cot(pi nu) (reflection, A&S 6.3.7); psi(b) = psi(1 + nu).
 *
 * Hot path: plain re/im numbers, results written into a caller's Float64Array, no allocation.
 */
import { gaussSeries } from './legendre-gauss';
import { prepareDegree, type LegendreDegree } from './legendre-degree';
import { logSeries } from './legendre-log';

export { prepareDegree, type LegendreDegree } from './legendre-degree';

/** Number of doubles legendreInto writes. */
export const LEGENDRE_OUT = 12;
/** Offsets (re at k, im at k+1): X, X', X'', Q, Q', Q''. */
export const L_X = 0,
  L_DX = 2,
  L_D2X = 4,
  L_Q = 6,
  L_DQ = 8,
  L_D2Q = 10;

/** Evaluates X, X', X'', Q, Q', Q'' at theta (radians, 0 < theta <= pi) into out. */
export function legendreInto(deg: LegendreDegree, theta: number, out: Float64Array): void {
  const s = Math.sin(theta);
  const c = Math.cos(theta);
  const half = Math.sin(theta / 2);
  const w = half * half;
  const ch = Math.cos(theta / 2);
  if (w >= 0.5 || deg.polynomial) gaussSeries(deg, ch * ch, s, c, out);
  else logSeries(deg, w, theta, s, c, out);
}

/** Convenience: P_nu(-cos theta) and d/dtheta as {re, im} pairs (allocates; not for hot loops). */
export function legendreAt(
  nuRe: number,
  nuIm: number,
  theta: number,
): { p: { re: number; im: number }; dp: { re: number; im: number } } {
  const out = new Float64Array(LEGENDRE_OUT);
  legendreInto(prepareDegree(nuRe, nuIm), theta, out);
  return { p: { re: out[0], im: out[1] }, dp: { re: out[2], im: out[3] } };
}
