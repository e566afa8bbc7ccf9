/**
 * The world map drawn on the server: the same frame as `WorldMap` (sphere,
 * graticule, land), but the outline reaches the browser as finished SVG and no
 * coastline data or projection code runs there. Overlays come as children,
 * usually a client component that projects with `makeProjection(width, height)`:
 *
 *   <WorldFrame width={900} height={460} title="Source regions">
 *     <MyOverlay width={900} height={460} />
 *   </WorldFrame>
 */
import { useId, type ReactNode } from 'react';
import { worldOutline } from './outline';

export interface WorldFrameProps {
  width: number;
  height: number;
  /** Accessible name of the figure. */
  title: string;
  /** Longer accessible description (what the overlays mean). */
  description?: string;
  /** SVG overlays in the projection's coordinates. */
  children?: ReactNode;
  className?: string;
}

export function WorldFrame({ width, height, title, description, children, className }: WorldFrameProps) {
  const idPrefix = useId();
  const outline = worldOutline(width, height);
  return (
    <svg
      viewBox={`0 0 ${width} ${height}`}
      role="img"
      aria-labelledby={`${idPrefix}-t${description ? ` ${idPrefix}-d` : ''}`}
      className={className ?? 'h-auto w-full'}
    >
      <title id={`${idPrefix}-t`}>{title}</title>
      {description ? <desc id={`${idPrefix}-d`}>{description}</desc> : null}
      <path d={outline.sphere} className="fill-sea stroke-line-strong" strokeWidth={1} />
      <path d={outline.graticule} fill="none" className="stroke-line" strokeWidth={0.5} />
      <path d={outline.land} className="fill-land stroke-line-strong" strokeWidth={0.4} />
      {children ? <g>{children}</g> : null}
    </svg>
  );
}
