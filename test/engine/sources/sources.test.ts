import { describe, expect, it } from 'vitest';
import { greatCircle } from '@/src/engine/geometry/great-circle';
import { spotNodes } from '@/src/engine/sources/spot';
import { cellsInBox, makeGlobalGrid, regionSources } from '@/src/engine/sources/grid';
import { isLand, landCellsInBox } from '@/src/engine/sources/land-mask';

const DEG = Math.PI / 180;

describe('spot regions (Radon 7-point rule for the disc; Stroud 1971, S2:5-1)', () => {
  it('integrates the uniform-disc moments up to degree 5 exactly (E[x^2] = R^2/4, E[x^4] = R^4/8, E[x^2 y^2] = R^4/24, odd moments 0)', () => {
    const R = 5 * DEG;
    const nodes = spotNodes(-20, 40, 5);
    expect(nodes.reduce((a, n) => a + n.weight, 0)).toBeCloseTo(1, 15);
    // azimuthal-equidistant coordinates of each node around the centre
    const xy = nodes.map((n) => {
      const g = greatCircle(-20, 40, n.lat, n.lon);
      return { x: g.theta * Math.sin(g.bearing), y: g.theta * Math.cos(g.bearing), w: n.weight };
    });
    const m = (f: (x: number, y: number) => number) => xy.reduce((a, p) => a + p.w * f(p.x, p.y), 0);
    expect(m((x) => x) / R).toBeCloseTo(0, 12);
    expect(m((x, y) => x * y * y) / R ** 3).toBeCloseTo(0, 12);
    expect(m((x) => x * x) / R ** 2).toBeCloseTo(1 / 4, 12);
    expect(m((_, y) => y * y) / R ** 2).toBeCloseTo(1 / 4, 12);
    expect(m((x) => x ** 4) / R ** 4).toBeCloseTo(1 / 8, 12);
    expect(m((x, y) => x * x * y * y) / R ** 4).toBeCloseTo(1 / 24, 12);
    expect(m((x, y) => x ** 3 * y * y) / R ** 5).toBeCloseTo(0, 12);
  });

  it('nodes move rigidly with the centre: pairwise distances do not change', () => {
    const a = spotNodes(0, 0, 7);
    const b = spotNodes(62, -130, 7);
    for (let i = 0; i < a.length; i++)
      for (let j = i + 1; j < a.length; j++)
        expect(greatCircle(b[i].lat, b[i].lon, b[j].lat, b[j].lon).theta).toBeCloseTo(
          greatCircle(a[i].lat, a[i].lon, a[j].lat, a[j].lon).theta,
          12,
        );
  });

  it('node derivatives with respect to the centre match central finite differences', () => {
    const h = 1e-6;
    for (const [lat, lon] of [
      [10, 20],
      [-55, 170],
      [70, -5],
    ]) {
      const n0 = spotNodes(lat, lon, 4);
      const up = spotNodes(lat + h, lon, 4);
      const dn = spotNodes(lat - h, lon, 4);
      n0.forEach((n, k) => {
        expect(n.dLatDLat).toBeCloseTo((up[k].lat - dn[k].lat) / (2 * h), 6);
        expect(n.dLonDLat).toBeCloseTo((up[k].lon - dn[k].lon) / (2 * h), 6);
        expect(n.dLatDLon).toBe(0);
        expect(n.dLonDLon).toBe(1);
      });
    }
  });

  it('a spot centred on a pole keeps its six ring nodes spread round the pole, continuous with a centre just off it', () => {
    const at = spotNodes(90, 30, 10);
    const near = spotNodes(90 - 1e-9, 30, 10);
    const ring = at.slice(1);
    // All six at the same colatitude sqrt(2/3) R, 60 degrees of longitude apart (a regular hexagon round the pole).
    for (const q of ring) expect(90 - q.lat).toBeCloseTo(Math.sqrt(2 / 3) * 10, 9);
    const lons = ring.map((q) => ((q.lon % 360) + 360) % 360).sort((a, b) => a - b);
    for (let k = 1; k < 6; k++) expect(lons[k] - lons[k - 1]).toBeCloseTo(60, 9);
    at.forEach((q, k) => {
      expect(q.lat).toBeCloseTo(near[k].lat, 6);
      if (k > 0) expect(Math.cos(((q.lon - near[k].lon) * Math.PI) / 180)).toBeCloseTo(1, 9);
    });
  });

  it('spread 0 gives the centre point alone', () => {
    expect(spotNodes(12, 34, 0)).toEqual([{ lat: 12, lon: 34, weight: 1, dLatDLat: 1, dLatDLon: 0, dLonDLat: 0, dLonDLon: 1 }]);
  });
});

describe('global grid and regions', () => {
  it('cell areas add up to the sphere, 4 pi steradians, and follow dLon (sin phi2 - sin phi1)', () => {
    const g = makeGlobalGrid(5);
    expect(g.cells.length).toBe(36 * 72);
    expect(g.cells.reduce((a, c) => a + c.area, 0)).toBeCloseTo(4 * Math.PI, 12);
    expect(() => makeGlobalGrid(7)).toThrow(/divide 180/);
  });

  it('spreads a region evenly per unit area, or by a weight map; shares add up to the intensity', () => {
    const g = makeGlobalGrid(10);
    const ids = cellsInBox(g, { latMin: -20, latMax: 60, lonMin: 170, lonMax: -170 }); // crosses the date line
    expect(ids.length).toBe(8 * 2);
    const even = regionSources(g, ids, 1000);
    expect(even.reduce((a, s) => a + s.intensity, 0)).toBeCloseTo(1000, 9);
    const eq = even.find((s) => s.lat === 5)!;
    const hi = even.find((s) => s.lat === 55)!;
    expect(hi.intensity / eq.intensity).toBeCloseTo(
      (Math.sin(60 * DEG) - Math.sin(50 * DEG)) / (Math.sin(10 * DEG) - Math.sin(0)),
      12,
    );
    const weighted = regionSources(
      g,
      ids,
      1000,
      new Map([
        [ids[0], 3],
        [ids[1], 1],
      ]),
    );
    expect(weighted.filter((s) => s.intensity > 0).length).toBe(2);
    expect(() => regionSources(g, [], 1)).toThrow(/at least one grid cell/);
  });

  it('land mask from world-atlas land-110m: land covers about 29% of the surface (common knowledge)', () => {
    expect(isLand(23, 10)).toBe(true); // Sahara
    expect(isLand(0, 22)).toBe(true); // Congo basin
    expect(isLand(0, -150)).toBe(false); // central Pacific
    expect(isLand(-30, -20)).toBe(false); // South Atlantic
    const g = makeGlobalGrid(3);
    const land = new Set(landCellsInBox(g, { latMin: -90, latMax: 90, lonMin: -180, lonMax: 180 }));
    const frac = g.cells.filter((c) => land.has(c.id)).reduce((a, c) => a + c.area, 0) / (4 * Math.PI);
    expect(frac).toBeGreaterThan(0.26);
    expect(frac).toBeLessThan(0.32);
  });
});
