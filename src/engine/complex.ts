/**
 * Small complex-number helpers for code outside hot loops. Hot loops (Legendre
 * series, kernel tables) work on plain re/im pairs instead.
 */
export type Complex = { re: number; im: number };

export const cx = (re: number, im = 0): Complex => ({ re, im });
export const cadd = (a: Complex, b: Complex): Complex => ({ re: a.re + b.re, im: a.im + b.im });
export const csub = (a: Complex, b: Complex): Complex => ({ re: a.re - b.re, im: a.im - b.im });
export const cmul = (a: Complex, b: Complex): Complex => ({ re: a.re * b.re - a.im * b.im, im: a.re * b.im + a.im * b.re });
export function cdiv(a: Complex, b: Complex): Complex {
  const d = b.re * b.re + b.im * b.im;
  return { re: (a.re * b.re + a.im * b.im) / d, im: (a.im * b.re - a.re * b.im) / d };
}
export const cabs = (a: Complex): number => Math.hypot(a.re, a.im);
export const cabs2 = (a: Complex): number => a.re * a.re + a.im * a.im;

/** Principal square root. */
export function csqrt(a: Complex): Complex {
  const r = Math.hypot(a.re, a.im);
  if (r === 0) return { re: 0, im: 0 };
  if (a.re >= 0) {
    const t = Math.sqrt((r + a.re) / 2);
    return { re: t, im: a.im / (2 * t) };
  }
  const t = Math.sqrt((r - a.re) / 2);
  return { re: Math.abs(a.im) / (2 * t), im: a.im >= 0 ? t : -t };
}

/** sin(pi z) for complex z. */
export function csinPi(z: Complex): Complex {
  const x = Math.PI * z.re;
  const y = Math.PI * z.im;
  return { re: Math.sin(x) * Math.cosh(y), im: Math.cos(x) * Math.sinh(y) };
}
