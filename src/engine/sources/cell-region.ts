/**
 * A region made of cells of the global grid, as the engine sees it when its
 * geometry is fixed: one point node per cell at the cell centre, weighted by
 * the cell's share of the region's area (the midpoint rule over the cells,
 * as regionSources spreads a forward intensity), and the region's place — the
 * normalised sum of the cells' centre unit vectors weighted by area — for
 * naming and drawing it. Used by the run solver and by case files, so both
 * see the same source.
 */
import { DEG } from '../constants';
import { makeGlobalGrid, type GlobalGrid } from './grid';

export interface FootprintNode {
  lat: number;
  lon: number;
  weight: number;
}
export interface CellRegion {
  lat: number;
  lon: number;
  areaSr: number;
  nodes: FootprintNode[];
}

const grids = new Map<number, GlobalGrid>();
function gridOf(cellDeg: number): GlobalGrid {
  let g = grids.get(cellDeg);
  if (!g) grids.set(cellDeg, (g = makeGlobalGrid(cellDeg)));
  return g;
}

/** Throws RangeError naming the first cell id that is not in the grid, or a repeated id. */
export function cellRegion(cellDeg: number, cellIds: readonly number[]): CellRegion {
  const grid = gridOf(cellDeg);
  if (cellIds.length === 0) throw new RangeError('a cell region needs at least one cell');
  const seen = new Set<number>();
  let x = 0,
    y = 0,
    z = 0,
    area = 0;
  for (const id of cellIds) {
    if (!Number.isInteger(id) || id < 0 || id >= grid.cells.length) {
      throw new RangeError(`cell ${id} is not in a ${cellDeg}-degree grid (ids 0 to ${grid.cells.length - 1})`);
    }
    if (seen.has(id)) throw new RangeError(`cell ${id} is listed twice`);
    seen.add(id);
    const c = grid.cells[id];
    x += c.area * Math.cos(c.lat * DEG) * Math.cos(c.lon * DEG);
    y += c.area * Math.cos(c.lat * DEG) * Math.sin(c.lon * DEG);
    z += c.area * Math.sin(c.lat * DEG);
    area += c.area;
  }
  const r = Math.hypot(x, y, z);
  // Cells spread evenly round the globe have no centre; the place is then only a label: the first cell's.
  const first = grid.cells[cellIds[0]];
  const place =
    r > 1e-9 * area ? { lat: Math.asin(z / r) / DEG, lon: Math.atan2(y, x) / DEG } : { lat: first.lat, lon: first.lon };
  return {
    ...place,
    areaSr: area,
    nodes: cellIds.map((id) => ({ lat: grid.cells[id].lat, lon: grid.cells[id].lon, weight: grid.cells[id].area / area })),
  };
}
