'use client';
/** Stations of a network on the equal-area world map; the current one ringed. */
import { WorldMap } from '@/src/web/map/WorldMap';

export interface MapStation {
  id: string;
  code: string;
  name: string;
  latitude: number;
  longitude: number;
}

export function StationMap({ stations, current, title }: { stations: MapStation[]; current?: string; title: string }) {
  return (
    <WorldMap
      width={800}
      height={400}
      title={title}
      description={`${stations.length} station${stations.length === 1 ? '' : 's'} shown as dots, labelled with their codes.`}
    >
      {(projection) =>
        stations.map((s) => {
          const p = projection([s.longitude, s.latitude]);
          if (!p) return null;
          const on = s.id === current;
          return (
            <g key={s.id}>
              <title>{`${s.code} — ${s.name} (${s.latitude.toFixed(2)}°, ${s.longitude.toFixed(2)}°)`}</title>
              {on ? <circle cx={p[0]} cy={p[1]} r={9} className="fill-none stroke-accent" strokeWidth={2} /> : null}
              <circle cx={p[0]} cy={p[1]} r={4} className="fill-accent stroke-surface" strokeWidth={1.5} />
              <text x={p[0] + 7} y={p[1] - 6} className="fill-fg font-mono" fontSize={11}>
                {s.code}
              </text>
            </g>
          );
        })
      }
    </WorldMap>
  );
}
