/**
 * Sample mean and spread (standard deviation with the n - 1 divisor; common
 * practice) of a list of numbers: NaN for an empty list, spread 0 for one value.
 */
export function meanAndSpread(xs: readonly number[]): { mean: number; spread: number } {
  const n = xs.length;
  const mean = n ? xs.reduce((a, b) => a + b, 0) / n : NaN;
  const spread = n > 1 ? Math.sqrt(xs.reduce((a, b) => a + (b - mean) ** 2, 0) / (n - 1)) : n ? 0 : NaN;
  return { mean, spread };
}
