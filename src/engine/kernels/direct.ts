/**
 * Table-free kernel evaluation: Ez and horizontal-B power per unit intensity
 * at one frequency and distance, straight from the Legendre functions. Used to
 * build kernel tables and as the reference they are checked against.
 */
import type { Cavity } from '../cavity/types';
import { LEGENDRE_OUT, legendreInto, prepareDegree } from '../special/legendre';
import { fieldFactors } from './field-constants';
import { KERNEL_MIN_THETA_DEG } from '../tolerances';
import { DEG } from '../constants';

export type DirectKernel = {
  /** (V/m)^2/Hz per C^2 km^2/s */
  ez: number;
  /** T^2/Hz per C^2 km^2/s, before projection on a coil */
  bh: number;
  /** d ez / d theta, d bh / d theta (per radian) */
  dEz: number;
  dBh: number;
};

/** theta is clamped to [KERNEL_MIN_THETA_DEG, 180 deg] like the tables (the source point itself is singular). */
export function directKernel(cavity: Cavity, fHz: number, theta: number): DirectKernel {
  theta = Math.min(Math.PI, Math.max(KERNEL_MIN_THETA_DEG * DEG, theta));
  const nu = cavity.nu(fHz);
  const { eFactor, bFactor } = fieldFactors(nu, fHz, cavity.radiusM, cavity.heightM);
  const out = new Float64Array(LEGENDRE_OUT);
  legendreInto(prepareDegree(nu.re, nu.im), theta, out);
  const [pRe, pIm, dRe, dIm, d2Re, d2Im] = out;
  const p2 = pRe * pRe + pIm * pIm;
  const d2 = dRe * dRe + dIm * dIm;
  return {
    ez: eFactor * p2,
    bh: bFactor * d2,
    dEz: eFactor * 2 * (pRe * dRe + pIm * dIm),
    dBh: bFactor * 2 * (dRe * d2Re + dIm * d2Im),
  };
}
