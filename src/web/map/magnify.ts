/**
 * Stated magnification for uncertainty marks too small to see: the least factor from 1, 2, 5, 10,
 * 20, 50, … that brings a mark of `extentPx` to at least `minPx` (so a 0.1° ellipse on a world map
 * still shows, and the figure says by how much it was enlarged).
 */
export function magnification(extentPx: number, minPx = 14): number {
  if (!(extentPx > 0) || extentPx >= minPx) return 1;
  for (let decade = 1; decade < 1e6; decade *= 10) {
    for (const step of [1, 2, 5]) {
      const m = step * decade;
      if (extentPx * m >= minPx) return m;
    }
  }
  return 1e6;
}

/** Largest width or height (px) of a projected outline. */
export function extentOf(points: [number, number][]): number {
  if (!points.length) return 0;
  const xs = points.map((p) => p[0]);
  const ys = points.map((p) => p[1]);
  return Math.max(Math.max(...xs) - Math.min(...xs), Math.max(...ys) - Math.min(...ys));
}
