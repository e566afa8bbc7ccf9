/**
 * Cell geometry of a global grid of size `d` degrees, numbered row by row from
 * the south pole and the antimeridian: row r covers latitudes
 * [-90 + r d, -90 + (r+1) d], column c covers longitudes [-180 + c d, -180 + (c+1) d],
 * index = r * cols + c. Plain arithmetic with no schema imports, so maps in the
 * browser can use it without the grid validation code (`grid-spec.ts`).
 */

export function gridShape(cellSizeDeg: number): { rows: number; cols: number; cells: number } {
  const rows = Math.round(180 / cellSizeDeg);
  const cols = Math.round(360 / cellSizeDeg);
  return { rows, cols, cells: rows * cols };
}

/** Bounds and centre of one cell, degrees. */
export function cellBox(cellSizeDeg: number, index: number) {
  const { cols } = gridShape(cellSizeDeg);
  const r = Math.floor(index / cols);
  const c = index - r * cols;
  const south = -90 + r * cellSizeDeg;
  const west = -180 + c * cellSizeDeg;
  return {
    south,
    north: south + cellSizeDeg,
    west,
    east: west + cellSizeDeg,
    lat: south + cellSizeDeg / 2,
    lon: west + cellSizeDeg / 2,
  };
}
