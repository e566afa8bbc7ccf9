'use client';
/** A saved source grid on the world map (read-only): region cells in their colours, moving regions as bounds and centre. */
import { geoPath } from 'd3-geo';
import { WorldMap } from '@/src/web/map/WorldMap';
import { cellBox, type Region } from '@/src/runs/grid-spec';

export function GridPreview({ cellSizeDeg, regions }: { cellSizeDeg: number; regions: Region[] }) {
  return (
    <div>
      <WorldMap width={900} height={460} title="Regions of this source grid">
        {(projection) => {
          const path = geoPath(projection);
          return regions.map((r) =>
            r.kind === 'cells'
              ? r.cells.map((c) => {
                  const b = cellBox(cellSizeDeg, c);
                  return (
                    <path
                      key={`${r.key}-${c}`}
                      d={
                        path({
                          type: 'Polygon',
                          coordinates: [
                            [
                              [b.west, b.south],
                              [b.west, b.north],
                              [b.east, b.north],
                              [b.east, b.south],
                              [b.west, b.south],
                            ],
                          ],
                        }) ?? ''
                      }
                      fill={r.colour}
                      fillOpacity={0.6}
                      stroke={r.colour}
                      strokeWidth={0.5}
                    >
                      <title>{r.name}</title>
                    </path>
                  );
                })
              : (() => {
                  const b = r.bounds;
                  const [x, y] = projection([r.centre.lon, r.centre.lat]) ?? [0, 0];
                  return (
                    <g key={r.key}>
                      <path
                        d={
                          path({
                            type: 'Polygon',
                            coordinates: [
                              [
                                [b.lon.min, b.lat.min],
                                [b.lon.min, b.lat.max],
                                [b.lon.max, b.lat.max],
                                [b.lon.max, b.lat.min],
                                [b.lon.min, b.lat.min],
                              ],
                            ],
                          }) ?? ''
                        }
                        fill={r.colour}
                        fillOpacity={0.15}
                        stroke={r.colour}
                        strokeWidth={1.5}
                        strokeDasharray="4 3"
                      >
                        <title>{r.name}</title>
                      </path>
                      <circle cx={x} cy={y} r={5} fill={r.colour} stroke="white" />
                    </g>
                  );
                })(),
          );
        }}
      </WorldMap>
      <ul className="mt-2 flex flex-wrap gap-4 text-sm">
        {regions.map((r) => (
          <li key={r.key}>
            <span className="mr-1 inline-block size-3 rounded-sm align-middle" style={{ background: r.colour }} />
            {r.name}
            <span className="text-muted">
              {' '}
              ·{' '}
              {r.kind === 'cells'
                ? `${r.cells.length} cells`
                : `moving, lat ${r.bounds.lat.min}…${r.bounds.lat.max}°, lon ${r.bounds.lon.min}…${r.bounds.lon.max}°, spread ${r.spreadDeg}°`}
            </span>
          </li>
        ))}
      </ul>
    </div>
  );
}
