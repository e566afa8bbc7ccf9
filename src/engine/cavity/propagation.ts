/**
 * Propagation parameter from phase-velocity ratio and attenuation
 * (Nickolaenko, Galuk & Hayakawa 2016, SpringerPlus):
 *   nu (nu + 1) = (k a S)^2,  k = 2 pi f / c,  nu = sqrt(1/4 + (k a S)^2) - 1/2,
 *   S = c/V - i * 5.49 * alpha / f   (alpha in dB/Mm).
 */
import { ATTENUATION_FACTOR, SPEED_OF_LIGHT } from '../constants';
import { csqrt } from '../complex';
import type { Nu } from './types';

export function nuFromSpeedAttenuation(fHz: number, radiusM: number, cOverV: number, alphaDbPerMm: number): Nu {
  const ka = (2 * Math.PI * fHz * radiusM) / SPEED_OF_LIGHT;
  const sRe = cOverV;
  const sIm = -(ATTENUATION_FACTOR * alphaDbPerMm) / fHz;
  // (k a S)^2
  const qRe = ka * ka * (sRe * sRe - sIm * sIm);
  const qIm = ka * ka * 2 * sRe * sIm;
  const r = csqrt({ re: 0.25 + qRe, im: qIm });
  return { re: r.re - 0.5, im: r.im };
}

/** Inverse relation: c/V and attenuation (dB/Mm) that give a propagation parameter nu at f. */
export function speedAttenuationFromNu(fHz: number, radiusM: number, nu: Nu): { cOverV: number; alphaDbPerMm: number } {
  const ka = (2 * Math.PI * fHz * radiusM) / SPEED_OF_LIGHT;
  // (k a S)^2 = nu (nu + 1)
  const pRe = nu.re * (nu.re + 1) - nu.im * nu.im;
  const pIm = nu.im * (2 * nu.re + 1);
  const s = csqrt({ re: pRe, im: pIm });
  return { cOverV: s.re / ka, alphaDbPerMm: ((-s.im / ka) * fHz) / ATTENUATION_FACTOR };
}
