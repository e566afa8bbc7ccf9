/**
 * Hann window. The periodic ("DFT-even") form w[j] = 0.5 - 0.5 cos(2 pi j / n)
 * is the one spectral estimators use (Harris 1978, Proc. IEEE 66, 51); the
 * symmetric form divides by n - 1 instead.
 */
const cache = new Map<string, Float64Array>();

export function hannWindow(n: number, periodic = true): Float64Array {
  if (!Number.isInteger(n) || n < 1) throw new RangeError(`window length must be a positive whole number, got ${n}`);
  const key = `${n}:${periodic}`;
  const hit = cache.get(key);
  if (hit) return hit;
  const w = new Float64Array(n);
  if (n === 1) w[0] = 1;
  else {
    const denom = periodic ? n : n - 1;
    for (let j = 0; j < n; j++) w[j] = 0.5 - 0.5 * Math.cos((2 * Math.PI * j) / denom);
  }
  cache.set(key, w);
  return w;
}

/** Sum of squared window values, the normalisation of a density-scaled periodogram. */
export function windowPower(w: Float64Array): number {
  let s = 0;
  for (let j = 0; j < w.length; j++) s += w[j] * w[j];
  return s;
}
