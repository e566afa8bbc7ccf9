/**
 * Per-degree constants of the complex-degree Legendre series, computed once per frequency:
 * lambda = nu(nu+1), K = 1/(Gamma(-nu) Gamma(1+nu)) = -sin(pi nu)/pi (reflection formula, A&S 6.1.17),
 * and d_0 = 2 psi(1) - psi(-nu) - psi(1+nu) with psi(-nu) = psi(1+nu) + pi cot(pi nu) (A&S 6.3.7).
 */
import { digammaInto } from './digamma';
import { firstCoefficients, type SeriesCoefficients } from './legendre-coefficients';

/** Per-degree constants, computed once per frequency. */
export type LegendreDegree = {
  nuRe: number;
  nuIm: number;
  /** lambda = nu (nu + 1) */
  lamRe: number;
  lamIm: number;
  /** K = -sin(pi nu) / pi */
  kRe: number;
  kIm: number;
  /** d_0 = 2 psi(1) - psi(-nu) - psi(1 + nu) */
  d0Re: number;
  d0Im: number;
  /** smallest term index after which the series terms decrease */
  nMin: number;
  /** real non-negative integer degree: the Gauss series is a polynomial, used at every theta */
  polynomial: boolean;
  /** The series coefficients c_n, d_n computed so far (legendre-coefficients.ts), shared by every theta. */
  coef: SeriesCoefficients;
};

const EULER_GAMMA = 0.5772156649015329;

export function prepareDegree(nuRe: number, nuIm: number): LegendreDegree {
  const psi = new Float64Array(2);
  digammaInto(1 + nuRe, nuIm, psi);
  // pi cot(pi nu), cot(x + iy) = (sin 2x - i sinh 2y) / (cosh 2y - cos 2x)
  const x2 = 2 * Math.PI * nuRe;
  const y2 = 2 * Math.PI * nuIm;
  const den = 2 * (Math.sinh(Math.PI * nuIm) ** 2 + Math.sin(Math.PI * nuRe) ** 2); // = cosh 2y - cos 2x
  const pcRe = (Math.PI * Math.sin(x2)) / den;
  const pcIm = (-Math.PI * Math.sinh(y2)) / den;
  // sin(pi nu) = sin(x) cosh(y) + i cos(x) sinh(y)
  const sx = Math.PI * nuRe;
  const sy = Math.PI * nuIm;
  const d0Re = -2 * EULER_GAMMA - (psi[0] + pcRe) - psi[0];
  const d0Im = -(psi[1] + pcIm) - psi[1];
  return {
    nuRe,
    nuIm,
    lamRe: nuRe * (nuRe + 1) - nuIm * nuIm,
    lamIm: nuIm * (2 * nuRe + 1),
    kRe: (-Math.sin(sx) * Math.cosh(sy)) / Math.PI,
    kIm: (-Math.cos(sx) * Math.sinh(sy)) / Math.PI,
    d0Re,
    d0Im,
    nMin: Math.ceil(Math.hypot(nuRe, nuIm)) + 4,
    polynomial: nuIm === 0 && Number.isInteger(nuRe) && nuRe >= 0,
    coef: firstCoefficients(d0Re, d0Im),
  };
}
