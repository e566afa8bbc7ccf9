/**
 * Per-frequency factors of the field kernels of a vertical source in the
 * uniform cavity (Nickolaenko & Hayakawa 2002; same form in Price 2016, Atmosphere 7, 116):
 *   E_r   = i nu(nu+1) M P_nu(-cos th) / (4 a^2 h eps0 w sin(pi nu))
 *   H_phi = M dP_nu(-cos th)/dth / (4 a h sin(pi nu)),  B = mu0 H.
 * For an intensity of 1 C^2 km^2/s (= 1e6 (A m)^2/Hz), power per unit intensity:
 *   ez = E_FACTOR |P|^2, E_FACTOR = 1e6 |nu(nu+1) / (4 a^2 h eps0 w sin(pi nu))|^2   [(V/m)^2/Hz]
 *   bh = B_FACTOR |dP/dth|^2, B_FACTOR = 1e6 |mu0 / (4 a h sin(pi nu))|^2            [T^2/Hz]
 */
import { EPS0, INTENSITY_TO_SI, MU0 } from '../constants';
import type { Nu } from '../cavity/types';

export function fieldFactors(nu: Nu, fHz: number, radiusM: number, heightM: number): { eFactor: number; bFactor: number } {
  const w = 2 * Math.PI * fHz;
  // |sin(pi nu)|^2 = sin^2(pi x) + sinh^2(pi y)
  const sx = Math.sin(Math.PI * nu.re);
  const sh = Math.sinh(Math.PI * nu.im);
  const sin2 = sx * sx + sh * sh;
  const lamRe = nu.re * (nu.re + 1) - nu.im * nu.im;
  const lamIm = nu.im * (2 * nu.re + 1);
  const lam2 = lamRe * lamRe + lamIm * lamIm;
  const eDen = 4 * radiusM * radiusM * heightM * EPS0 * w;
  const bDen = 4 * radiusM * heightM;
  return {
    eFactor: (INTENSITY_TO_SI * lam2) / (eDen * eDen * sin2),
    bFactor: (INTENSITY_TO_SI * MU0 * MU0) / (bDen * bDen * sin2),
  };
}
