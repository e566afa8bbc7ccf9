/**
 * From a run's chosen regions to the inverter's unknowns.
 *
 * - A moving region: centre free within the run's lat/lon ranges (fixed at the
 *   region's centre where no range is given), spread fixed at the region's
 *   spread (a spot region), intensity free.
 * - A region of grid cells: one node per cell, weighted by area (the engine's
 *   cellRegion footprint), placed at the cells' area-weighted centroid. Fixed
 *   in place; intensity free.
 */
import type { RegionUnknown } from '@/src/engine/inverse/types';
import { cellRegion } from '@/src/engine/sources/cell-region';
import type { RunConfig } from './config';
import type { Region } from './grid-spec';

export function buildUnknowns(config: RunConfig, grid: { cellSizeDeg: number; regions: Region[] }): RegionUnknown[] {
  const byKey = new Map(grid.regions.map((r) => [r.key, r]));
  return config.regions.map((u) => {
    const r = byKey.get(u.region);
    if (!r) throw new Error(`region "${u.region}" is not in the run's grid`);
    if (r.kind === 'cells') {
      const c = cellRegion(grid.cellSizeDeg, r.cells);
      return { name: r.name, intensity: u.intensity, lat: c.lat, lon: c.lon, footprint: c.nodes };
    }
    return {
      name: r.name,
      intensity: u.intensity,
      lat: u.lat ?? r.centre.lat,
      lon: u.lon ?? r.centre.lon,
      ...(r.spreadDeg > 0 ? { spread: r.spreadDeg } : {}),
    };
  });
}
