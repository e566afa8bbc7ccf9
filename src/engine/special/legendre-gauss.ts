/**
 * Gauss series of P_nu(-cos theta) = 2F1(-nu, nu+1; 1; z), z = cos^2(theta/2) <= 1/2 (A&S 15.1.1),
 * with its term-wise z-derivatives F', F'', F'''. Writes X, X', X'', Q, Q', Q'' (see legendre.ts).
 */
import { LEGENDRE_MAX_TERMS, LEGENDRE_SERIES_REL_TOL } from '../tolerances';
import { extendCoefficients } from './legendre-coefficients';
import type { LegendreDegree } from './legendre-degree';

/** z <= 1/2: F, F', F'', F''' in z, then chain rule with z' = -sin/2, z'' = -cos/2. */
export function gaussSeries(deg: LegendreDegree, z: number, s: number, c: number, out: Float64Array): void {
  const { nMin } = deg;
  let co = deg.coef; // t_n = c_n
  let z0 = 1,
    zm1 = 0,
    zm2 = 0,
    zm3 = 0; // z^n, z^(n-1), z^(n-2), z^(n-3)
  let f0Re = 0,
    f0Im = 0,
    f1Re = 0,
    f1Im = 0,
    f2Re = 0,
    f2Im = 0,
    f3Re = 0,
    f3Im = 0;
  for (let n = 0; n < LEGENDRE_MAX_TERMS; n++) {
    if (n >= co.count) co = extendCoefficients(deg, co, Math.min(2 * n, LEGENDRE_MAX_TERMS));
    const tRe = co.cRe[n],
      tIm = co.cIm[n];
    const n1 = n * (n - 1);
    const n2 = n1 * (n - 2);
    f0Re += tRe * z0;
    f0Im += tIm * z0;
    f1Re += n * tRe * zm1;
    f1Im += n * tIm * zm1;
    f2Re += n1 * tRe * zm2;
    f2Im += n1 * tIm * zm2;
    f3Re += n2 * tRe * zm3;
    f3Im += n2 * tIm * zm3;
    if (n > nMin) {
      const mag = Math.abs(tRe) + Math.abs(tIm);
      const tol = LEGENDRE_SERIES_REL_TOL;
      if (
        mag * z0 <= tol * (Math.abs(f0Re) + Math.abs(f0Im)) &&
        n2 * mag * zm3 <= tol * (Math.abs(f3Re) + Math.abs(f3Im) + 1e-300) &&
        n * mag * zm1 <= tol * (Math.abs(f1Re) + Math.abs(f1Im))
      )
        break;
    }
    zm3 = zm2;
    zm2 = zm1;
    zm1 = z0;
    z0 *= z;
  }
  const zp = -s / 2;
  const zpp = -c / 2;
  out[0] = f0Re;
  out[1] = f0Im;
  out[2] = f1Re * zp;
  out[3] = f1Im * zp;
  out[4] = f2Re * zp * zp + f1Re * zpp;
  out[5] = f2Im * zp * zp + f1Im * zpp;
  // Q = X'/sin = -F'/2; Q' = F'' sin/4; Q'' = (F'' cos - F''' sin^2 / 2)/4
  out[6] = -f1Re / 2;
  out[7] = -f1Im / 2;
  out[8] = (f2Re * s) / 4;
  out[9] = (f2Im * s) / 4;
  out[10] = (f2Re * c - (f3Re * s * s) / 2) / 4;
  out[11] = (f2Im * c - (f3Im * s * s) / 2) / 4;
}
