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
import { LEGENDRE_MAX_TERMS, LEGENDRE_SERIES_REL_TOL } from '../tolerances';
import { digammaInto } from './digamma';

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
  return {
    nuRe,
    nuIm,
    lamRe: nuRe * (nuRe + 1) - nuIm * nuIm,
    lamIm: nuIm * (2 * nuRe + 1),
    kRe: (-Math.sin(sx) * Math.cosh(sy)) / Math.PI,
    kIm: (-Math.cos(sx) * Math.sinh(sy)) / Math.PI,
    d0Re: -2 * EULER_GAMMA - (psi[0] + pcRe) - psi[0],
    d0Im: -(psi[1] + pcIm) - psi[1],
    nMin: Math.ceil(Math.hypot(nuRe, nuIm)) + 4,
    polynomial: nuIm === 0 && Number.isInteger(nuRe) && nuRe >= 0,
  };
}

/** Number of doubles legendreInto writes. */
export const LEGENDRE_OUT = 12;
/** Offsets (re at k, im at k+1): X, X', X'', Q, Q', Q''. */
export const L_X = 0, L_DX = 2, L_D2X = 4, L_Q = 6, L_DQ = 8, L_D2Q = 10;

/** Evaluates X, X', X'', Q, Q', Q'' at theta (radians, 0 < theta <= pi) into out. */
export function legendreInto(deg: LegendreDegree, theta: number, out: Float64Array): void {
  const s = Math.sin(theta);
  const c = Math.cos(theta);
  const half = Math.sin(theta / 2);
  const w = half * half;
  if (w >= 0.5 || deg.polynomial) gaussSeries(deg, 1 - w, s, c, out);
  else logSeries(deg, w, theta, s, c, out);
}

/** z <= 1/2: F, F', F'', F''' in z, then chain rule with z' = -sin/2, z'' = -cos/2. */
function gaussSeries(deg: LegendreDegree, z: number, s: number, c: number, out: Float64Array): void {
  const { lamRe, lamIm, nMin } = deg;
  let tRe = 1, tIm = 0; // t_n
  let z0 = 1, zm1 = 0, zm2 = 0, zm3 = 0; // z^n, z^(n-1), z^(n-2), z^(n-3)
  let f0Re = 0, f0Im = 0, f1Re = 0, f1Im = 0, f2Re = 0, f2Im = 0, f3Re = 0, f3Im = 0;
  for (let n = 0; n < LEGENDRE_MAX_TERMS; n++) {
    const n1 = n * (n - 1);
    const n2 = n1 * (n - 2);
    f0Re += tRe * z0; f0Im += tIm * z0;
    f1Re += n * tRe * zm1; f1Im += n * tIm * zm1;
    f2Re += n1 * tRe * zm2; f2Im += n1 * tIm * zm2;
    f3Re += n2 * tRe * zm3; f3Im += n2 * tIm * zm3;
    if (n > nMin) {
      const mag = Math.abs(tRe) + Math.abs(tIm);
      const tol = LEGENDRE_SERIES_REL_TOL;
      if (mag * z0 <= tol * (Math.abs(f0Re) + Math.abs(f0Im)) &&
          n2 * mag * zm3 <= tol * (Math.abs(f3Re) + Math.abs(f3Im) + 1e-300) &&
          n * mag * zm1 <= tol * (Math.abs(f1Re) + Math.abs(f1Im))) break;
    }
    // t_{n+1} = t_n (n(n+1) - lambda) / (n+1)^2
    const fRe = (n * (n + 1) - lamRe) / ((n + 1) * (n + 1));
    const fIm = -lamIm / ((n + 1) * (n + 1));
    const nr = tRe * fRe - tIm * fIm;
    tIm = tRe * fIm + tIm * fRe;
    tRe = nr;
    zm3 = zm2; zm2 = zm1; zm1 = z0; z0 *= z;
  }
  const zp = -s / 2;
  const zpp = -c / 2;
  out[0] = f0Re; out[1] = f0Im;
  out[2] = f1Re * zp; out[3] = f1Im * zp;
  out[4] = f2Re * zp * zp + f1Re * zpp; out[5] = f2Im * zp * zp + f1Im * zpp;
  // Q = X'/sin = -F'/2; Q' = F'' sin/4; Q'' = (F'' cos - F''' sin^2 / 2)/4
  out[6] = -f1Re / 2; out[7] = -f1Im / 2;
  out[8] = (f2Re * s) / 4; out[9] = (f2Im * s) / 4;
  out[10] = (f2Re * c - (f3Re * s * s) / 2) / 4; out[11] = (f2Im * c - (f3Im * s * s) / 2) / 4;
}

/** w < 1/2: A&S 15.3.10 and its term-wise w-derivative; higher derivatives from the Legendre equation. */
function logSeries(deg: LegendreDegree, w: number, theta: number, s: number, c: number, out: Float64Array): void {
  const { nuRe, nuIm, lamRe, lamIm, kRe, kIm, nMin } = deg;
  const L = Math.log(w);
  let cRe = 1, cIm = 0; // c_n
  let dRe = deg.d0Re, dIm = deg.d0Im; // d_n
  let wn = 1, wm1 = 0; // w^n, w^(n-1)
  let s0Re = 0, s0Im = 0, s1Re = 0, s1Im = 0;
  for (let n = 0; n < LEGENDRE_MAX_TERMS; n++) {
    const eRe = dRe - L; // d_n - ln w (ln w is real)
    const eIm = dIm;
    const pRe = cRe * eRe - cIm * eIm;
    const pIm = cRe * eIm + cIm * eRe;
    s0Re += pRe * wn; s0Im += pIm * wn;
    if (n > 0) {
      // c_n w^(n-1) (n (d_n - L) - 1)
      s1Re += (n * pRe - cRe) * wm1; s1Im += (n * pIm - cIm) * wm1;
    }
    if (n > nMin) {
      const mag = Math.abs(pRe) + Math.abs(pIm) + Math.abs(cRe) + Math.abs(cIm);
      const tol = LEGENDRE_SERIES_REL_TOL;
      if (mag * wn <= tol * (Math.abs(s0Re) + Math.abs(s0Im)) && n * mag * wm1 <= tol * (Math.abs(s1Re) + Math.abs(s1Im) + 1e-300)) break;
    }
    // d_{n+1} = d_n + 2/(n+1) - 1/(n - nu) - 1/(n + 1 + nu)
    const aRe = n - nuRe, aIm = -nuIm;
    const bRe = n + 1 + nuRe, bIm = nuIm;
    const ad = aRe * aRe + aIm * aIm;
    const bd = bRe * bRe + bIm * bIm;
    dRe += 2 / (n + 1) - aRe / ad - bRe / bd;
    dIm += aIm / ad + bIm / bd;
    // c_{n+1} = c_n (n(n+1) - lambda) / (n+1)^2
    const fRe = (n * (n + 1) - lamRe) / ((n + 1) * (n + 1));
    const fIm = -lamIm / ((n + 1) * (n + 1));
    const nr = cRe * fRe - cIm * fIm;
    cIm = cRe * fIm + cIm * fRe;
    cRe = nr;
    wm1 = wn; wn *= w;
  }
  // X = K S0; X' = K (-cot(theta/2) + (sin/2) S1)
  const xRe = kRe * s0Re - kIm * s0Im;
  const xIm = kRe * s0Im + kIm * s0Re;
  const cot2 = 1 / Math.tan(theta / 2);
  const gRe = -cot2 + (s / 2) * s1Re;
  const gIm = (s / 2) * s1Im;
  const x1Re = kRe * gRe - kIm * gIm;
  const x1Im = kRe * gIm + kIm * gRe;
  // Legendre equation: X'' = -cot X' - lam X;  X''' = -cot X'' + X'/sin^2 - lam X'
  const cot = c / s;
  const x2Re = -cot * x1Re - (lamRe * xRe - lamIm * xIm);
  const x2Im = -cot * x1Im - (lamRe * xIm + lamIm * xRe);
  const is2 = 1 / (s * s);
  const x3Re = -cot * x2Re + x1Re * is2 - (lamRe * x1Re - lamIm * x1Im);
  const x3Im = -cot * x2Im + x1Im * is2 - (lamRe * x1Im + lamIm * x1Re);
  out[0] = xRe; out[1] = xIm;
  out[2] = x1Re; out[3] = x1Im;
  out[4] = x2Re; out[5] = x2Im;
  // Q = X'/s; Q' = X''/s - X' c/s^2; Q'' = X'''/s - 2 X'' c/s^2 + X' (1/s + 2 c^2/s^3)
  const is = 1 / s;
  const k3 = is + 2 * c * c * is2 * is;
  out[6] = x1Re * is; out[7] = x1Im * is;
  out[8] = x2Re * is - x1Re * c * is2; out[9] = x2Im * is - x1Im * c * is2;
  out[10] = x3Re * is - 2 * x2Re * c * is2 + x1Re * k3;
  out[11] = x3Im * is - 2 * x2Im * c * is2 + x1Im * k3;
}

/** Convenience: P_nu(-cos theta) and d/dtheta as {re, im} pairs (allocates; not for hot loops). */
export function legendreAt(nuRe: number, nuIm: number, theta: number): { p: { re: number; im: number }; dp: { re: number; im: number } } {
  const out = new Float64Array(LEGENDRE_OUT);
  legendreInto(prepareDegree(nuRe, nuIm), theta, out);
  return { p: { re: out[0], im: out[1] }, dp: { re: out[2], im: out[3] } };
}
