'use client';
/**
 * The world map every page draws on: equal-area projection (Equal Earth,
 * Šavrič, Patterson & Jenny 2018) via d3-geo, Natural Earth land at 1:110m
 * from world-atlas, a 30° graticule. Overlays come from a render prop that
 * receives the projection:
 *
 *   <WorldMap title="Stations" width={800} height={420}>
 *     {(projection) => stations.map((s) => {
 *       const [x, y] = projection([s.lon, s.lat])!;
 *       return <circle key={s.id} cx={x} cy={y} r={4} className="fill-accent" />;
 *     })}
 *   </WorldMap>
 */
import { useId, useMemo, type ReactNode } from 'react';
import { geoEqualEarth, geoGraticule10, geoPath, type GeoProjection } from 'd3-geo';
import { feature } from 'topojson-client';
import type { Topology, GeometryCollection } from 'topojson-specification';
import landTopo from 'world-atlas/land-110m.json';

const land = feature(landTopo as unknown as Topology, (landTopo as unknown as Topology).objects.land as GeometryCollection);
const sphere = { type: 'Sphere' } as const;
const graticule = geoGraticule10();

export interface WorldMapProps {
  width: number;
  height: number;
  /** Accessible name of the figure, e.g. "Stations of the network". */
  title: string;
  /** Longer accessible description (what the overlays mean). */
  description?: string;
  /** Overlays drawn over land, in SVG coordinates of the projection. */
  children?: (projection: GeoProjection) => ReactNode;
  className?: string;
}

export function makeProjection(width: number, height: number): GeoProjection {
  return geoEqualEarth().fitExtent(
    [
      [2, 2],
      [width - 2, height - 2],
    ],
    sphere,
  );
}

export function WorldMap({ width, height, title, description, children, className }: WorldMapProps) {
  const id = useId();
  const projection = useMemo(() => makeProjection(width, height), [width, height]);
  const paths = useMemo(() => {
    const path = geoPath(projection);
    return { sphere: path(sphere) ?? '', land: path(land) ?? '', graticule: path(graticule) ?? '' };
  }, [projection]);

  return (
    <svg
      viewBox={`0 0 ${width} ${height}`}
      role="img"
      aria-labelledby={`${id}-t${description ? ` ${id}-d` : ''}`}
      className={className ?? 'h-auto w-full'}
    >
      <title id={`${id}-t`}>{title}</title>
      {description ? <desc id={`${id}-d`}>{description}</desc> : null}
      <path d={paths.sphere} className="fill-sea stroke-line-strong" strokeWidth={1} />
      <path d={paths.graticule} fill="none" className="stroke-line" strokeWidth={0.5} />
      <path d={paths.land} className="fill-land stroke-line-strong" strokeWidth={0.4} />
      {children ? <g>{children(projection)}</g> : null}
    </svg>
  );
}
