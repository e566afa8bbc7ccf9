/**
 * A global latitude/longitude grid of square cells and regions made of cells.
 * Cell area on the unit sphere: dLon * (sin(latTop) - sin(latBottom)) steradians
 * (area of a spherical latitude–longitude rectangle).
 */
import { DEG } from '../constants';
import type { ForwardSource } from './types';

export type GridCell = {
  id: number;
  lat: number;
  lon: number;
  latMin: number;
  latMax: number;
  lonMin: number;
  lonMax: number;
  area: number;
};
export type GlobalGrid = { cellDeg: number; rows: number; cols: number; cells: GridCell[] };

export function makeGlobalGrid(cellDeg: number): GlobalGrid {
  const rows = Math.round(180 / cellDeg);
  const cols = Math.round(360 / cellDeg);
  if (!(cellDeg > 0) || Math.abs(rows * cellDeg - 180) > 1e-9 || Math.abs(cols * cellDeg - 360) > 1e-9)
    throw new RangeError(`grid cell size must divide 180 degrees evenly, got ${cellDeg}`);
  const cells: GridCell[] = [];
  for (let r = 0; r < rows; r++) {
    const latMin = -90 + r * cellDeg;
    const latMax = latMin + cellDeg;
    const area = cellDeg * DEG * (Math.sin(latMax * DEG) - Math.sin(latMin * DEG));
    for (let c = 0; c < cols; c++) {
      const lonMin = -180 + c * cellDeg;
      cells.push({
        id: r * cols + c,
        lat: latMin + cellDeg / 2,
        lon: lonMin + cellDeg / 2,
        latMin,
        latMax,
        lonMin,
        lonMax: lonMin + cellDeg,
        area,
      });
    }
  }
  return { cellDeg, rows, cols, cells };
}

export type LatLonBox = { latMin: number; latMax: number; lonMin: number; lonMax: number };

/** True when (lat, lon) lies inside the box; a box with lonMin > lonMax crosses the date line. */
export function inBox(box: LatLonBox, lat: number, lon: number): boolean {
  if (lat < box.latMin || lat > box.latMax) return false;
  const l = ((lon + 540) % 360) - 180;
  return box.lonMin <= box.lonMax ? l >= box.lonMin && l <= box.lonMax : l >= box.lonMin || l <= box.lonMax;
}

/** Ids of the cells whose centre lies inside the box. */
export function cellsInBox(grid: GlobalGrid, box: LatLonBox): number[] {
  return grid.cells.filter((c) => inBox(box, c.lat, c.lon)).map((c) => c.id);
}

/**
 * Spreads a region's intensity over its cells: evenly per unit area, or in proportion
 * to area x weight when a weight map (cell id -> relative weight >= 0) is given.
 * Returns one point source per cell at the cell centre; the intensities add up to `intensity`.
 */
export function regionSources(
  grid: GlobalGrid,
  cellIds: readonly number[],
  intensity: number,
  weights?: ReadonlyMap<number, number>,
): ForwardSource[] {
  if (cellIds.length === 0) throw new RangeError('a region needs at least one grid cell');
  const shares = cellIds.map((id) => {
    const cell = grid.cells[id];
    if (!cell) throw new RangeError(`cell ${id} is not on the ${grid.cellDeg}-degree grid`);
    const w = weights ? (weights.get(id) ?? 0) : 1;
    if (!(w >= 0)) throw new RangeError(`cell ${id}: weight must be 0 or more, got ${w}`);
    return cell.area * w;
  });
  const total = shares.reduce((a, b) => a + b, 0);
  if (!(total > 0)) throw new RangeError('the region has no cell with a positive weight');
  return cellIds.map((id, k) => ({
    name: `cell ${id}`,
    lat: grid.cells[id].lat,
    lon: grid.cells[id].lon,
    intensity: (intensity * shares[k]) / total,
  }));
}
