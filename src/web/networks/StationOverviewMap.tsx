'use client';
import { WorldMap } from '@/src/web/map/WorldMap';
import { EmptyState, ButtonLink } from '@/src/web/ui';

interface Point {
  id: string;
  code: string;
  name: string;
  lat: number;
  lon: number;
  intervals: number;
}

/** The network's stations on the equal-area world map, labelled by code. */
export function StationOverviewMap({ stations, networkId }: { stations: Point[]; networkId: string }) {
  return (
    <div className="relative">
      <WorldMap
        width={960}
        height={470}
        title="Stations of this network"
        description={`${stations.length} stations; dots mark their positions.`}
      >
        {(projection) =>
          stations.map((s) => {
            const xy = projection([s.lon, s.lat]);
            if (!xy) return null;
            return (
              <g key={s.id} transform={`translate(${xy[0]},${xy[1]})`}>
                <circle r={9} className="fill-accent/20" />
                <circle r={4.5} className="fill-accent stroke-surface" strokeWidth={1.5} />
                <text x={8} y={-7} className="fill-fg text-[11px] font-medium">
                  {s.code}
                </text>
              </g>
            );
          })
        }
      </WorldMap>
      {stations.length === 0 ? (
        <div className="absolute inset-x-6 bottom-6">
          <div className="bg-surface/95">
            <EmptyState
              title="No stations yet"
              action={
                <ButtonLink href={`/n/${networkId}/stations`} tone="primary" size="sm">
                  Add a station
                </ButtonLink>
              }
            >
              Add your first ELF station with its position and components; it appears here on the map.
            </EmptyState>
          </div>
        </div>
      ) : null}
    </div>
  );
}
