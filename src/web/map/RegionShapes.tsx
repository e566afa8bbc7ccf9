/**
 * Source-grid regions drawn on a map projection: a region of fixed cells as
 * its cells, a moving region as its bounds (dashed) with the centre marked.
 * The grid editor, the grid preview and the run map share the geometry.
 */
import { geoPath, type GeoProjection } from 'd3-geo';
import type { Region } from '@/src/runs/grid-spec';
import { cellBox } from '@/src/runs/grid-cells';

/** A longitude/latitude box as a GeoJSON polygon (west, south, east, north in degrees). */
export function lonLatBox(west: number, south: number, east: number, north: number) {
  return {
    type: 'Polygon' as const,
    coordinates: [
      [
        [west, south],
        [west, north],
        [east, north],
        [east, south],
        [west, south],
      ],
    ],
  };
}

/** The SVG path of one grid cell. */
export function cellPath(path: ReturnType<typeof geoPath>, cellSizeDeg: number, cell: number): string {
  const b = cellBox(cellSizeDeg, cell);
  return path(lonLatBox(b.west, b.south, b.east, b.north)) ?? '';
}

export function RegionShapes({
  projection,
  regions,
  cellSizeDeg,
  cellOpacity,
  titled = false,
}: {
  projection: GeoProjection;
  regions: Region[];
  cellSizeDeg: number;
  /** Fill opacity of the cells of the region at this index. */
  cellOpacity: (index: number) => number;
  /** Whether each shape carries the region's name as its tooltip. */
  titled?: boolean;
}) {
  const path = geoPath(projection);
  const title = (r: Region) => (titled ? <title>{r.name}</title> : null);
  return regions.map((r, i) => {
    if (r.kind === 'cells') {
      return r.cells.map((c) => (
        <path
          key={`${r.key}-${c}`}
          d={cellPath(path, cellSizeDeg, c)}
          fill={r.colour}
          fillOpacity={cellOpacity(i)}
          stroke={r.colour}
          strokeWidth={0.5}
        >
          {title(r)}
        </path>
      ));
    }
    const b = r.bounds;
    const [x, y] = projection([r.centre.lon, r.centre.lat]) ?? [0, 0];
    return (
      <g key={r.key}>
        <path
          d={path(lonLatBox(b.lon.min, b.lat.min, b.lon.max, b.lat.max)) ?? ''}
          fill={r.colour}
          fillOpacity={0.15}
          stroke={r.colour}
          strokeWidth={1.5}
          strokeDasharray="4 3"
        >
          {title(r)}
        </path>
        <circle cx={x} cy={y} r={5} fill={r.colour} stroke="white" />
      </g>
    );
  });
}
