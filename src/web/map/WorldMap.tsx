'use client';
/**
 * The world map every page draws on: equal-area projection (Equal Earth,
 * Šavrič, Patterson & Jenny 2018) via d3-geo, Natural Earth land at 1:110m
 * from world-atlas, a 30° graticule (`outline.ts`). Overlays come from a render
 * prop that receives the projection. Pages that need no interaction in the
 * outline itself can use the server-drawn `WorldFrame` instead, which keeps
 * the coastline data out of the browser.
 *
 *   <WorldMap title="Stations" width={800} height={420}>
 *     {(projection) => stations.map((s) => {
 *       const [x, y] = projection([s.lon, s.lat])!;
 *       return <circle key={s.id} cx={x} cy={y} r={4} className="fill-accent" />;
 *     })}
 *   </WorldMap>
 */
import { useId, useMemo, type ReactNode } from 'react';
import type { GeoProjection } from 'd3-geo';
import { makeProjection } from './projection';
import { worldOutline } from './outline';

export { makeProjection };

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

export function WorldMap({ width, height, title, description, children, className }: WorldMapProps) {
  const id = useId();
  const projection = useMemo(() => makeProjection(width, height), [width, height]);
  const paths = worldOutline(width, height); // projected once per size, then from memory

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
