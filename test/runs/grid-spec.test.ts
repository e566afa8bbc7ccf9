/** Cell geometry of source grids and the centroid of cell regions. */
import { describe, expect, it } from 'vitest';
import { cellAt, cellBox, cellsInBox, gridShape, gridProblems, CELL_SIZES } from '@/src/runs/grid-spec';
import { cellRegion } from '@/src/engine/sources/cell-region';

const D = Math.PI / 180;

describe('global grid cells', () => {
  it('tile the sphere: cell areas add up to 4 pi (area of a lat/lon cell = dlon (sin north - sin south), Snyder 1987, Map Projections USGS PP 1395)', () => {
    for (const d of CELL_SIZES) {
      const { cells } = gridShape(d);
      let area = 0;
      for (let i = 0; i < cells; i++) {
        const b = cellBox(d, i);
        area += (b.east - b.west) * D * (Math.sin(b.north * D) - Math.sin(b.south * D));
      }
      expect(area).toBeCloseTo(4 * Math.PI, 9);
    }
  });

  it('find the cell holding a point, consistent with its box', () => {
    for (const [lat, lon] of [
      [0.1, 0.1],
      [-89.9, -179.9],
      [89.9, 179.9],
      [12.3, -45.6],
    ]) {
      const b = cellBox(5, cellAt(5, lat, lon));
      expect(lat).toBeGreaterThanOrEqual(b.south);
      expect(lat).toBeLessThanOrEqual(b.north);
      expect(lon).toBeGreaterThanOrEqual(b.west);
      expect(lon).toBeLessThanOrEqual(b.east);
    }
  });

  it('select cells in a box that crosses the antimeridian', () => {
    const cells = cellsInBox(10, { south: -10, north: 10, west: 170, east: -170 });
    expect(cells.map((c) => cellBox(10, c).lon).sort((a, b) => a - b)).toEqual([-175, -175, 175, 175]);
  });

  it("numbers cells as the engine does, so a region's footprint is the cells the editor shows", () => {
    const cells = [cellAt(10, 5, 15), cellAt(10, -5, 15), cellAt(10, 5, 25), cellAt(10, -5, 25)];
    const c = cellRegion(10, cells);
    expect(c.lat).toBeCloseTo(0, 12);
    expect(c.lon).toBeCloseTo(20, 12);
    expect(c.nodes.map((q) => [q.lat, q.lon])).toEqual(cells.map((id) => [cellBox(10, id).lat, cellBox(10, id).lon]));
  });

  it('report duplicate names and a centre outside its bounds', () => {
    const p = gridProblems({
      name: 'g',
      notes: '',
      cellSizeDeg: 10,
      regions: [
        { key: 'a', name: 'Same', colour: '#eb476b', kind: 'cells', cells: [1] },
        {
          key: 'b',
          name: 'same',
          colour: '#6dc4ff',
          kind: 'moving',
          centre: { lat: 50, lon: 0 },
          bounds: { lat: { min: -10, max: 10 }, lon: { min: -10, max: 10 } },
          spreadDeg: 0,
        },
      ],
    });
    expect(p.map((x) => x.field)).toEqual(['regions.1.name', 'regions.1.centre']);
  });

  it('limit the cells a grid names in all, and refuse a cell named twice', () => {
    const grid = (cells: number[]) => ({
      name: 'g',
      notes: '',
      cellSizeDeg: 2,
      regions: [{ key: 'a', name: 'A', colour: '#E69F00', kind: 'cells' as const, cells }],
    });
    // A 2° grid has 90 x 180 = 16200 cells; the default limit is 10000 named cells.
    const many = Array.from({ length: 10001 }, (_, i) => i);
    expect(gridProblems(grid(many))).toEqual([
      { field: 'regions', message: 'the regions name 10001 cells; a grid may have at most 10000 cells in all' },
    ]);
    expect(gridProblems(grid(many.slice(0, 10000)))).toEqual([]);
    expect(gridProblems(grid(many.slice(0, 50)), { maxCells: 40 })[0].field).toBe('regions');
    expect(gridProblems(grid([5, 6, 5]))).toEqual([{ field: 'regions.0.cells', message: 'region "A" names cell 5 twice' }]);
  });
});
