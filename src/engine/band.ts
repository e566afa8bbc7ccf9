/** Frequency band of a run: the grid minHz, minHz + stepHz, ... <= maxHz. */
export type Band = { minHz: number; maxHz: number; stepHz: number };

/** Largest number of bins a band may hold (keeps kernel tables bounded: about 86 kB per bin). */
export const MAX_BAND_BINS = 2_000;

/** Number of bins of a band (tolerant of rounding at the top edge). */
export function bandSize(band: Band): number {
  return Math.floor((band.maxHz - band.minHz) / band.stepHz + 1e-9) + 1;
}

/** The band's frequency grid. Throws on a band that is not a valid grid. */
export function bandFrequencies(band: Band): Float64Array {
  const problem = bandProblem(band);
  if (problem) throw new RangeError(problem);
  const n = bandSize(band);
  const out = new Float64Array(n);
  for (let i = 0; i < n; i++) out[i] = band.minHz + i * band.stepHz;
  return out;
}

/** A description of what is wrong with a band, or null when it is fine. */
export function bandProblem(band: Band): string | null {
  const { minHz, maxHz, stepHz } = band;
  if (![minHz, maxHz, stepHz].every(Number.isFinite)) return 'band: minHz, maxHz and stepHz must be finite numbers';
  if (minHz <= 0) return `band.minHz must be above 0 Hz, got ${minHz}`;
  if (maxHz < minHz) return `band.maxHz (${maxHz}) must not be below band.minHz (${minHz})`;
  if (stepHz <= 0) return `band.stepHz must be above 0, got ${stepHz}`;
  if (bandSize(band) > MAX_BAND_BINS) return `band holds ${bandSize(band)} bins; at most ${MAX_BAND_BINS} are allowed`;
  return null;
}

/** A stable key for caching per frequency grid (any grid, uniform or not: every value counts). */
export function bandKey(freqs: Float64Array): string {
  return `${freqs.length}:${freqs.join(',')}`;
}
