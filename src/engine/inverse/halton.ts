/**
 * Reproducible quasi-random start points: the Halton sequence (Halton 1960,
 * Numerische Mathematik 2, 84–90) in the first primes, randomised by a seeded
 * Cranley–Patterson rotation (Cranley & Patterson 1976, SIAM J. Numer. Anal.
 * 13, 904–914): u = frac(h + shift), with the shift drawn from a seeded
 * mulberry32 generator. Start i depends only on (seed, i, bounds), never on
 * how the starts are scheduled.
 */
import { mulberry32 } from '../random';

const PRIMES = [
  2, 3, 5, 7, 11, 13, 17, 19, 23, 29, 31, 37, 41, 43, 47, 53, 59, 61, 67, 71, 73, 79, 83, 89, 97, 101, 103, 107, 109, 113,
];

/** Radical inverse of i in the given base (van der Corput). */
export function radicalInverse(i: number, base: number): number {
  let f = 1;
  let r = 0;
  while (i > 0) {
    f /= base;
    r += f * (i % base);
    i = Math.floor(i / base);
  }
  return r;
}

/** The seeded rotation of each dimension. */
export function haltonShift(seed: number, dims: number): Float64Array {
  const rnd = mulberry32(seed * 2654435761 + 12345);
  return Float64Array.from({ length: dims }, () => rnd());
}

/** Point i (0-based) of the rotated Halton sequence, in the unit cube. */
export function haltonPoint(i: number, shift: Float64Array, out: Float64Array): Float64Array {
  if (shift.length > PRIMES.length) throw new RangeError(`at most ${PRIMES.length} dimensions for quasi-random starts`);
  for (let d = 0; d < shift.length; d++) {
    const u = radicalInverse(i + 1, PRIMES[d]) + shift[d];
    out[d] = u - Math.floor(u);
  }
  return out;
}

/** Start i mapped onto the box [lower, upper] (infinite bounds fall back to `fallback`). */
export function startPoint(
  i: number,
  seed: number,
  lower: Float64Array,
  upper: Float64Array,
  fallback?: Float64Array,
): Float64Array {
  const n = lower.length;
  const u = haltonPoint(i, haltonShift(seed, n), new Float64Array(n));
  const out = new Float64Array(n);
  for (let j = 0; j < n; j++) {
    const lo = lower[j];
    const hi = upper[j];
    out[j] = Number.isFinite(lo) && Number.isFinite(hi) ? lo + u[j] * (hi - lo) : (fallback?.[j] ?? 0);
  }
  return out;
}
