/**
 * Logarithmic continuation of P_nu(-cos theta) for w = sin^2(theta/2) < 1/2 (A&S 15.3.10,
 * the case c = a + b), its term-wise w-derivative, and higher theta-derivatives from the
 * Legendre equation. Writes X, X', X'', Q, Q', Q'' (see legendre.ts).
 */
import { LEGENDRE_MAX_TERMS, LEGENDRE_SERIES_REL_TOL } from '../tolerances';
import { extendCoefficients } from './legendre-coefficients';
import type { LegendreDegree } from './legendre-degree';

/** w < 1/2: A&S 15.3.10 and its term-wise w-derivative; higher derivatives from the Legendre equation. */
export function logSeries(deg: LegendreDegree, w: number, theta: number, s: number, c: number, out: Float64Array): void {
  const { lamRe, lamIm, kRe, kIm, nMin } = deg;
  const L = Math.log(w);
  let co = deg.coef; // c_n, d_n
  let wn = 1,
    wm1 = 0; // w^n, w^(n-1)
  let s0Re = 0,
    s0Im = 0,
    s1Re = 0,
    s1Im = 0;
  for (let n = 0; n < LEGENDRE_MAX_TERMS; n++) {
    if (n >= co.count) co = extendCoefficients(deg, co, Math.min(2 * n, LEGENDRE_MAX_TERMS));
    const cRe = co.cRe[n],
      cIm = co.cIm[n];
    const eRe = co.dRe[n] - L; // d_n - ln w (ln w is real)
    const eIm = co.dIm[n];
    const pRe = cRe * eRe - cIm * eIm;
    const pIm = cRe * eIm + cIm * eRe;
    s0Re += pRe * wn;
    s0Im += pIm * wn;
    if (n > 0) {
      // c_n w^(n-1) (n (d_n - L) - 1)
      s1Re += (n * pRe - cRe) * wm1;
      s1Im += (n * pIm - cIm) * wm1;
    }
    if (n > nMin) {
      const mag = Math.abs(pRe) + Math.abs(pIm) + Math.abs(cRe) + Math.abs(cIm);
      const tol = LEGENDRE_SERIES_REL_TOL;
      if (
        mag * wn <= tol * (Math.abs(s0Re) + Math.abs(s0Im)) &&
        n * mag * wm1 <= tol * (Math.abs(s1Re) + Math.abs(s1Im) + 1e-300)
      )
        break;
    }
    wm1 = wn;
    wn *= w;
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
  out[0] = xRe;
  out[1] = xIm;
  out[2] = x1Re;
  out[3] = x1Im;
  out[4] = x2Re;
  out[5] = x2Im;
  // Q = X'/s; Q' = X''/s - X' c/s^2; Q'' = X'''/s - 2 X'' c/s^2 + X' (1/s + 2 c^2/s^3)
  const is = 1 / s;
  const k3 = is + 2 * c * c * is2 * is;
  out[6] = x1Re * is;
  out[7] = x1Im * is;
  out[8] = x2Re * is - x1Re * c * is2;
  out[9] = x2Im * is - x1Im * c * is2;
  out[10] = x3Re * is - 2 * x2Re * c * is2 + x1Re * k3;
  out[11] = x3Im * is - 2 * x2Im * c * is2 + x1Im * k3;
}
