/**
 * From a run's chosen regions to the inverter's unknowns.
 *
 * - A moving region: centre free within the run's lat/lon ranges (fixed at the
 *   region's centre where no range is given), spread fixed at the region's
 *   spread (a spot region), intensity free.
 * - A region of grid cells: a uniform spot of the same area centred at the
 *   cells' area-weighted centroid (mean of unit vectors weighted by cell area,
 *   which on a sphere is proportional to sin(north) - sin(south)); a spherical
 *   cap of area A has angular radius acos(1 - A / 2 pi) (unit sphere). Centre
 *   and spread fixed, intensity free.
 */
import type { RegionUnknown } from '@/src/engine/inverse/types';
import type { RunConfig } from './config';
import { cellBox, type Region } from './grid-spec';

const D = Math.PI / 180;

export function cellCentroid(cellSizeDeg: number, cells: number[]): { lat: number; lon: number } {
  let x = 0, y = 0, z = 0;
  for (const c of cells) {
    const b = cellBox(cellSizeDeg, c);
    const w = Math.sin(b.north * D) - Math.sin(b.south * D);
    x += w * Math.cos(b.lat * D) * Math.cos(b.lon * D);
    y += w * Math.cos(b.lat * D) * Math.sin(b.lon * D);
    z += w * Math.sin(b.lat * D);
  }
  const r = Math.hypot(x, y, z);
  if (!(r > 0)) throw new Error('a cell region needs at least one cell');
  return { lat: Math.asin(z / r) / D, lon: Math.atan2(y, x) / D };
}

/** Angular radius (degrees) of a spherical cap with the cells' total area. */
export function equalAreaRadius(cellSizeDeg: number, cells: number[]): number {
  let area = 0;
  for (const c of cells) {
    const b = cellBox(cellSizeDeg, c);
    area += cellSizeDeg * D * (Math.sin(b.north * D) - Math.sin(b.south * D));
  }
  return Math.acos(Math.max(-1, 1 - area / (2 * Math.PI))) / D;
}

export function buildUnknowns(config: RunConfig, grid: { cellSizeDeg: number; regions: Region[] }): RegionUnknown[] {
  const byKey = new Map(grid.regions.map((r) => [r.key, r]));
  return config.regions.map((u) => {
    const r = byKey.get(u.region);
    if (!r) throw new Error(`region "${u.region}" is not in the run's grid`);
    if (r.kind === 'cells') {
      const c = cellCentroid(grid.cellSizeDeg, r.cells);
      return { name: r.name, intensity: u.intensity, lat: c.lat, lon: c.lon, spread: equalAreaRadius(grid.cellSizeDeg, r.cells) };
    }
    return {
      name: r.name, intensity: u.intensity, lat: u.lat ?? r.centre.lat, lon: u.lon ?? r.centre.lon,
      ...(r.spreadDeg > 0 ? { spread: r.spreadDeg } : {}),
    };
  });
}
