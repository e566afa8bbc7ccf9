/**
 * Complex digamma psi(z) = Gamma'(z)/Gamma(z).
 * Reflection psi(z) = psi(1 - z) - pi cot(pi z) for Re z < 1/2 (A&S 6.3.7),
 * recurrence psi(z) = psi(z + 1) - 1/z (A&S 6.3.5) up to Re z >= DIGAMMA_ASYMPTOTIC_MIN,
 * then the asymptotic series psi(z) ~ ln z - 1/(2z) - sum B_2k / (2k z^2k) (A&S 6.3.18).
 * Plain re/im numbers in and out; no allocation.
 */
import { DIGAMMA_ASYMPTOTIC_MIN } from '../tolerances';

/** B_2k / (2k) for k = 1..7 (Bernoulli numbers, A&S Table 23.2). */
const B2K_OVER_2K = [1 / 12, -1 / 120, 1 / 252, -1 / 240, 1 / 132, -691 / 32760, 1 / 12];

/** Writes psi(re + i im) into out[0] (real) and out[1] (imaginary). */
export function digammaInto(re: number, im: number, out: Float64Array | number[]): void {
  let accRe = 0;
  let accIm = 0;
  if (re < 0.5) {
    // psi(z) = psi(1 - z) - pi cot(pi z); cot(x + iy) = (sin 2x - i sinh 2y) / (cosh 2y - cos 2x)
    const x2 = 2 * Math.PI * re;
    const y2 = 2 * Math.PI * im;
    // cosh 2y - cos 2x = 2 (sinh^2 y + sin^2 x), without cancellation near the poles
    const den = 2 * (Math.sinh(Math.PI * im) ** 2 + Math.sin(Math.PI * re) ** 2);
    accRe -= (Math.PI * Math.sin(x2)) / den;
    accIm -= (Math.PI * -Math.sinh(y2)) / den;
    re = 1 - re;
    im = -im;
  }
  while (re < DIGAMMA_ASYMPTOTIC_MIN) {
    // acc -= 1 / z
    const d = re * re + im * im;
    accRe -= re / d;
    accIm += im / d;
    re += 1;
  }
  // 1/z and 1/z^2
  const d = re * re + im * im;
  const iRe = re / d;
  const iIm = -im / d;
  const i2Re = iRe * iRe - iIm * iIm;
  const i2Im = 2 * iRe * iIm;
  // Horner in 1/z^2 for sum_k c_k (1/z^2)^k
  let sRe = 0;
  let sIm = 0;
  for (let k = B2K_OVER_2K.length - 1; k >= 0; k--) {
    const tRe = (sRe + B2K_OVER_2K[k]) * i2Re - sIm * i2Im;
    const tIm = (sRe + B2K_OVER_2K[k]) * i2Im + sIm * i2Re;
    sRe = tRe;
    sIm = tIm;
  }
  out[0] = accRe + 0.5 * Math.log(d) - 0.5 * iRe - sRe;
  out[1] = accIm + Math.atan2(im, re) - 0.5 * iIm - sIm;
}

export function digamma(re: number, im: number): { re: number; im: number } {
  const o = [0, 0];
  digammaInto(re, im, o);
  return { re: o[0], im: o[1] };
}
