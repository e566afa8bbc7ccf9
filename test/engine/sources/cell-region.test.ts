/**
 * Cell regions as fixed footprints, checked against facts of spherical
 * geometry: the top row of a grid is a polar cap (area 2 pi (1 - cos d),
 * Archimedes' hat-box theorem), a hemisphere has area 2 pi, a cell's area is
 * proportional to sin(north) - sin(south), and the centroid of cells placed
 * symmetrically about a meridian or a pole lies on that meridian or pole.
 */
import { describe, expect, it } from 'vitest';
import { cellRegion } from '@/src/engine/sources/cell-region';
import { makeGlobalGrid } from '@/src/engine/sources/grid';

const D = Math.PI / 180;
const idsWhere = (deg: number, keep: (c: { lat: number; lon: number }) => boolean) =>
  makeGlobalGrid(deg)
    .cells.filter(keep)
    .map((c) => c.id);

describe('cell regions as fixed footprints', () => {
  it('the northernmost row of 10-degree cells is the polar cap of radius 10 degrees, in 36 equal shares', () => {
    const r = cellRegion(
      10,
      idsWhere(10, (c) => c.lat > 80),
    );
    expect(r.lat).toBeCloseTo(90, 9);
    expect(r.areaSr).toBeCloseTo(2 * Math.PI * (1 - Math.cos(10 * D)), 12);
    expect(r.nodes).toHaveLength(36);
    for (const q of r.nodes) {
      expect(q.lat).toBe(85);
      expect(q.weight).toBeCloseTo(1 / 36, 14);
    }
  });

  it('the southern hemisphere of 5-degree cells has area 2 pi and its place at the south pole', () => {
    const r = cellRegion(
      5,
      idsWhere(5, (c) => c.lat < 0),
    );
    expect(r.lat).toBeCloseTo(-90, 9);
    expect(r.areaSr).toBeCloseTo(2 * Math.PI, 12);
    expect(r.nodes.reduce((a, q) => a + q.weight, 0)).toBeCloseTo(1, 12);
  });

  it('weights cells by area: sin(north) - sin(south) of their rows', () => {
    const r = cellRegion(10, [
      ...idsWhere(10, (c) => c.lat === 5 && c.lon === 65),
      ...idsWhere(10, (c) => c.lat === 45 && c.lon === 65),
    ]);
    expect(r.nodes[0].weight / r.nodes[1].weight).toBeCloseTo(Math.sin(10 * D) / (Math.sin(50 * D) - Math.sin(40 * D)), 12);
    expect(r.lon).toBeCloseTo(65, 12);
  });

  it('two cells either side of the antimeridian have their place on it; one cell sits at its own centre with weight 1', () => {
    const pair = cellRegion(
      10,
      idsWhere(10, (c) => c.lat === 25 && Math.abs(c.lon) === 175),
    );
    expect(Math.abs(pair.lon)).toBeCloseTo(180, 9);
    const one = cellRegion(
      10,
      idsWhere(10, (c) => c.lat === -35 && c.lon === 65),
    );
    expect([one.lat, one.lon]).toEqual([-35, 65].map((x) => expect.closeTo(x, 12)));
    expect(one.nodes).toEqual([{ lat: -35, lon: 65, weight: 1 }]);
  });

  it('names a cell outside the grid, a repeated cell, an empty list and a size that does not divide 180', () => {
    expect(() => cellRegion(10, [648])).toThrow('cell 648 is not in a 10-degree grid (ids 0 to 647)');
    expect(() => cellRegion(10, [3, 4, 3])).toThrow('cell 3 is listed twice');
    expect(() => cellRegion(10, [])).toThrow('at least one cell');
    expect(() => cellRegion(7, [1])).toThrow(/divide 180/);
  });
});
