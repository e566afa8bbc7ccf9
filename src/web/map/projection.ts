/**
 * The equal-area projection every map uses: Equal Earth (Šavrič, Patterson &
 * Jenny 2018) fitted to a width x height box with a 2 px margin. Kept apart
 * from the land outline so overlays can project points without shipping the
 * coastline data to the browser.
 */
import { geoEqualEarth, type GeoProjection } from 'd3-geo';

export const SPHERE = { type: 'Sphere' } as const;

export function makeProjection(width: number, height: number): GeoProjection {
  return geoEqualEarth().fitExtent(
    [
      [2, 2],
      [width - 2, height - 2],
    ],
    SPHERE,
  );
}
