/**
 * Joint confidence regions for two parameters from a chi-square misfit: the region where
 * chi2 - chi2_min <= delta holds the true pair with probability 1 - exp(-delta / 2) (chi-square
 * with two degrees of freedom), so delta = 2.30 for 68.3 % and 6.18 for 95.4 % (Press et al.,
 * Numerical Recipes, §15.6, table of delta chi-square). Used for the map's centre ellipses
 * (k = sqrt(delta) standard-error ellipses) and the misfit surfaces' contours.
 */
import { contours } from 'd3-contour';

export const JOINT_2D = [
  { label: '68 %', deltaChi2: 2.3 },
  { label: '95 %', deltaChi2: 6.18 },
] as const;

/** Coverage of the region chi2 - chi2_min <= delta for two parameters. */
export function coverage2d(deltaChi2: number): number {
  return 1 - Math.exp(-deltaChi2 / 2);
}

/** Position along sorted grid values at a fractional index (linear between neighbours, geometric on a log axis). */
function along(values: number[], t: number, log: boolean): number {
  const i = Math.min(values.length - 2, Math.max(0, Math.floor(t)));
  const u = Math.min(1, Math.max(0, t - i));
  if (values.length === 1) return values[0];
  return log ? values[i] * (values[i + 1] / values[i]) ** u : values[i] + u * (values[i + 1] - values[i]);
}

export interface SurfaceGrid {
  x: number[];
  y: number[];
  /** misfit[j][i] at (x[i], y[j]). */
  misfit: number[][];
  /** The misfit at the minimum the surface is centred on (the lower of it and the grid's own least value is used). */
  minimum?: number;
}

/**
 * Contour lines chi2 = chi2_min + delta of a surface, as rings of [x, y] points in data units
 * (marching squares, d3-contour, on the grid's index space, mapped back along each axis).
 */
export function deltaChi2Contours(
  s: SurfaceGrid,
  deltas: readonly number[],
  log: { x: boolean; y: boolean } = { x: false, y: false },
): { deltaChi2: number; rings: [number, number][][] }[] {
  const nx = s.x.length;
  const ny = s.y.length;
  if (nx < 2 || ny < 2) return deltas.map((d) => ({ deltaChi2: d, rings: [] }));
  const flat = s.misfit.flat();
  const least = Math.min(...flat.filter(Number.isFinite), s.minimum ?? Infinity);
  // d3-contour outlines where values >= threshold: negated, that is the region chi2 <= chi2_min + delta.
  const values = flat.map((v) => (Number.isFinite(v) ? -v : -Number.MAX_VALUE));
  const found = contours()
    .size([nx, ny])
    .smooth(true)
    .thresholds(deltas.map((d) => -(least + d)))(values);
  // d3-contour places value k of a row at k + 0.5 of its coordinate space.
  // (d3 sorts the thresholds; each contour carries its own value.)
  const byDelta = new Map(found.map((c) => [c.value, c]));
  return deltas
    .map((d) => ({ d, c: byDelta.get(-(least + d))! }))
    .map(({ d, c }) => ({
      deltaChi2: d,
      rings: c.coordinates.flatMap((polygon) =>
        polygon.map((ring) => ring.map(([a, b]) => [along(s.x, a - 0.5, log.x), along(s.y, b - 0.5, log.y)] as [number, number])),
      ),
    }));
}
