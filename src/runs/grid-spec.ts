/**
 * Source grids and their regions: the shape stored in `source_grids.regions`,
 * its zod schema, and the checks an editor and the API both run (overlapping
 * cells, empty regions, bounds that leave the globe, duplicate names).
 *
 * Cells of a global grid of size `d` degrees are numbered row by row from the
 * south pole and the antimeridian: row r covers latitudes [-90 + r d, -90 + (r+1) d],
 * column c covers longitudes [-180 + c d, -180 + (c+1) d], index = r * cols + c.
 */
import { z } from 'zod';
import { cellBox, gridShape } from './grid-cells';

export const CELL_SIZES = [2, 2.5, 3, 4, 5, 6, 9, 10, 15, 18, 20, 30] as const;

const range = (lo: number, hi: number) =>
  z
    .object({ min: z.number().min(lo).max(hi), max: z.number().min(lo).max(hi) })
    .refine((r) => r.min < r.max, { message: 'the lower bound must be below the upper bound' });

const common = {
  key: z.string().regex(/^[a-z0-9][a-z0-9-]{0,39}$/, 'use lower-case letters, digits and dashes'),
  name: z.string().trim().min(1, 'give the region a name').max(60),
  colour: z.string().regex(/^#[0-9a-fA-F]{6}$/, 'a colour like #425fe1'),
};

export const cellRegionSchema = z.object({
  ...common,
  kind: z.literal('cells'),
  cells: z.array(z.number().int().min(0)),
});

export const movingRegionSchema = z.object({
  ...common,
  kind: z.literal('moving'),
  centre: z.object({ lat: z.number().min(-90).max(90), lon: z.number().min(-180).max(180) }),
  bounds: z.object({ lat: range(-90, 90), lon: range(-180, 180) }),
  spreadDeg: z.number().min(0).max(30),
});

export const regionSchema = z.discriminatedUnion('kind', [cellRegionSchema, movingRegionSchema]);
export type Region = z.infer<typeof regionSchema>;
export type CellRegion = z.infer<typeof cellRegionSchema>;
export type MovingRegion = z.infer<typeof movingRegionSchema>;

export const gridInputSchema = z.object({
  name: z.string().trim().min(1, 'give the grid a name').max(80),
  notes: z.string().max(2000).default(''),
  cellSizeDeg: z.number().refine((d) => (CELL_SIZES as readonly number[]).includes(d), {
    message: `cell size must be one of ${CELL_SIZES.join(', ')} degrees`,
  }),
  regions: z.array(regionSchema).max(24, 'at most 24 regions per grid'),
});
export type GridInput = z.infer<typeof gridInputSchema>;

export { gridShape, cellBox } from './grid-cells';

/** The cell holding a point (lat in [-90, 90], lon in [-180, 180]). */
export function cellAt(cellSizeDeg: number, lat: number, lon: number): number {
  const { rows, cols } = gridShape(cellSizeDeg);
  const r = Math.min(rows - 1, Math.max(0, Math.floor((lat + 90) / cellSizeDeg)));
  const c = Math.min(cols - 1, Math.max(0, Math.floor((lon + 180) / cellSizeDeg)));
  return r * cols + c;
}

/** Cells whose centres fall inside a lat/lon box (west > east crosses the antimeridian). */
export function cellsInBox(cellSizeDeg: number, box: { south: number; north: number; west: number; east: number }): number[] {
  const { cells } = gridShape(cellSizeDeg);
  const out: number[] = [];
  for (let i = 0; i < cells; i++) {
    const b = cellBox(cellSizeDeg, i);
    const inLat = b.lat >= box.south && b.lat <= box.north;
    const inLon = box.west <= box.east ? b.lon >= box.west && b.lon <= box.east : b.lon >= box.west || b.lon <= box.east;
    if (inLat && inLon) out.push(i);
  }
  return out;
}

export type GridProblem = { field: string; message: string };

/** Cells a grid's cell regions may name in all, unless the server's settings say otherwise (GRID_MAX_CELLS). */
export const DEFAULT_GRID_MAX_CELLS = 10000;

/** Everything wrong with a grid, in the order an editor should show it (empty list = valid). */
export function gridProblems(grid: GridInput, opts: { maxCells?: number } = {}): GridProblem[] {
  const problems: GridProblem[] = [];
  const { cells } = gridShape(grid.cellSizeDeg);
  const maxCells = opts.maxCells ?? DEFAULT_GRID_MAX_CELLS;
  const named = grid.regions.reduce((n, r) => n + (r.kind === 'cells' ? r.cells.length : 0), 0);
  if (named > maxCells)
    return [{ field: 'regions', message: `the regions name ${named} cells; a grid may have at most ${maxCells} cells in all` }];
  const owner = new Map<number, string>();
  const keys = new Set<string>();
  const names = new Set<string>();
  grid.regions.forEach((r, i) => {
    const at = `regions.${i}`;
    if (keys.has(r.key)) problems.push({ field: `${at}.key`, message: `region key "${r.key}" is used twice` });
    keys.add(r.key);
    if (names.has(r.name.toLowerCase())) problems.push({ field: `${at}.name`, message: `region name "${r.name}" is used twice` });
    names.add(r.name.toLowerCase());
    if (r.kind === 'cells') {
      if (r.cells.length === 0)
        problems.push({ field: `${at}.cells`, message: `region "${r.name}" has no cells: select at least one` });
      for (const c of r.cells) {
        if (c >= cells) {
          problems.push({
            field: `${at}.cells`,
            message: `region "${r.name}" names cell ${c}, outside this ${grid.cellSizeDeg}° grid (${cells} cells)`,
          });
          break;
        }
        const other = owner.get(c);
        if (other !== undefined) {
          problems.push({
            field: `${at}.cells`,
            message:
              other === r.name
                ? `region "${r.name}" names cell ${c} twice`
                : `regions "${other}" and "${r.name}" overlap (cell ${c})`,
          });
          break;
        }
        owner.set(c, r.name);
      }
    } else {
      const { lat, lon } = r.bounds;
      if (r.centre.lat < lat.min || r.centre.lat > lat.max || r.centre.lon < lon.min || r.centre.lon > lon.max) {
        problems.push({ field: `${at}.centre`, message: `the centre of "${r.name}" lies outside its bounds` });
      }
    }
  });
  return problems;
}
