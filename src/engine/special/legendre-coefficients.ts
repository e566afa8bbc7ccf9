/**
 * The theta-independent coefficients of the two Legendre series of one degree
 * (legendre-gauss.ts, legendre-log.ts), computed once per degree and extended
 * on demand, so that a kernel table, which evaluates the series at many theta
 * for the same degree, pays only multiplications and additions per term:
 *   c_n = (a)_n (b)_n / (n!)^2 with c_{n+1} = c_n (n(n+1) - lambda) / (n+1)^2
 *   (the Gauss series' t_n are the same numbers), and
 *   d_n = 2 psi(n+1) - psi(a+n) - psi(b+n) with d_{n+1} = d_n + 2/(n+1) - 1/(n - nu) - 1/(n + 1 + nu)
 * (A&S 15.3.10 with a = -nu, b = 1 + nu). The recurrences run in the same order as term-by-term evaluation
 * would, so the values are the same bit for bit.
 */

export interface SeriesCoefficients {
  /** How many terms are ready (indexes 0..count-1). */
  count: number;
  cRe: Float64Array;
  cIm: Float64Array;
  dRe: Float64Array;
  dIm: Float64Array;
}

/** What the recurrences need of a degree. */
interface Degree {
  nuRe: number;
  nuIm: number;
  lamRe: number;
  lamIm: number;
}

const FIRST_CAPACITY = 64;

/** c_0 = 1 and d_0 = the given value; more terms come from extendCoefficients. */
export function firstCoefficients(d0Re: number, d0Im: number): SeriesCoefficients {
  const co = {
    count: 1,
    cRe: new Float64Array(FIRST_CAPACITY),
    cIm: new Float64Array(FIRST_CAPACITY),
    dRe: new Float64Array(FIRST_CAPACITY),
    dIm: new Float64Array(FIRST_CAPACITY),
  };
  co.cRe[0] = 1;
  co.dRe[0] = d0Re;
  co.dIm[0] = d0Im;
  return co;
}

/** Makes at least `terms` terms ready (doubling the storage as needed) and returns the coefficients. */
export function extendCoefficients(deg: Degree, co: SeriesCoefficients, terms: number): SeriesCoefficients {
  if (terms > co.cRe.length) {
    const size = Math.max(terms, 2 * co.cRe.length);
    for (const key of ['cRe', 'cIm', 'dRe', 'dIm'] as const) {
      const grown = new Float64Array(size);
      grown.set(co[key]);
      co[key] = grown;
    }
  }
  const { cRe, cIm, dRe, dIm } = co;
  for (let n = co.count - 1; n < terms - 1; n++) {
    const aRe = n - deg.nuRe,
      aIm = -deg.nuIm;
    const bRe = n + 1 + deg.nuRe,
      bIm = deg.nuIm;
    const ad = aRe * aRe + aIm * aIm;
    const bd = bRe * bRe + bIm * bIm;
    dRe[n + 1] = dRe[n] + (2 / (n + 1) - aRe / ad - bRe / bd);
    dIm[n + 1] = dIm[n] + (aIm / ad + bIm / bd);
    const fRe = (n * (n + 1) - deg.lamRe) / ((n + 1) * (n + 1));
    const fIm = -deg.lamIm / ((n + 1) * (n + 1));
    cRe[n + 1] = cRe[n] * fRe - cIm[n] * fIm;
    cIm[n + 1] = cRe[n] * fIm + cIm[n] * fRe;
  }
  co.count = Math.max(co.count, terms);
  return co;
}
