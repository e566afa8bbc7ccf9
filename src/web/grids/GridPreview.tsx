'use client';
/** A saved source grid on the world map (read-only): region cells in their colours, moving regions as bounds and centre. */
import { WorldMap } from '@/src/web/map/WorldMap';
import { RegionShapes } from '@/src/web/map/RegionShapes';
import type { Region } from '@/src/runs/grid-spec';

export function GridPreview({ cellSizeDeg, regions }: { cellSizeDeg: number; regions: Region[] }) {
  return (
    <div>
      <WorldMap width={900} height={460} title="Regions of this source grid">
        {(projection) => (
          <RegionShapes projection={projection} regions={regions} cellSizeDeg={cellSizeDeg} cellOpacity={() => 0.6} titled />
        )}
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
