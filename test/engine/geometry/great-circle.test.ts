import { describe, expect, it } from 'vitest';
import { geoDistance, geoRotation } from 'd3-geo';
import { destination, greatCircle } from '@/src/engine/geometry/great-circle';

const DEG = Math.PI / 180;

/** Bearing from d3-geo alone: rotate the station to the north pole; the original pole's and the
 * source's rotated longitudes then differ by the bearing (clockwise from north = decreasing longitude). */
function d3Bearing(stLat: number, stLon: number, lat: number, lon: number): number {
  const rot = geoRotation([-stLon, 90 - stLat]);
  const [srcLon] = rot([lon, lat]);
  const [poleLon] = rot([0, 90]);
  let b = (poleLon - srcLon) * DEG;
  b = ((b % (2 * Math.PI)) + 2 * Math.PI) % (2 * Math.PI);
  return b;
}

function seeded(seed: number): () => number {
  let s = seed >>> 0;
  return () => (s = (s * 1664525 + 1013904223) >>> 0) / 2 ** 32;
}

describe('great circle distance and bearing', () => {
  it('LAX -> JFK worked example: d = 0.623585 rad, initial course 66 deg (Ed Williams, Aviation Formulary; from memory)', () => {
    // LAX 33°57'N 118°24'W, JFK 40°38'N 73°47'W
    const g = greatCircle(33 + 57 / 60, -(118 + 24 / 60), 40 + 38 / 60, -(73 + 47 / 60));
    expect(g.theta).toBeCloseTo(0.623585, 5);
    expect(g.bearing / DEG).toBeCloseTo(65.89, 1); // 1.150035 rad
  });

  it('agrees with d3-geo geoDistance and a bearing from d3-geo rotations over random pairs', () => {
    const rnd = seeded(7);
    for (let k = 0; k < 500; k++) {
      const a = [Math.asin(2 * rnd() - 1) / DEG, 360 * rnd() - 180];
      const b = [Math.asin(2 * rnd() - 1) / DEG, 360 * rnd() - 180];
      const g = greatCircle(a[0], a[1], b[0], b[1]);
      expect(g.theta).toBeCloseTo(geoDistance([a[1], a[0]], [b[1], b[0]]), 10);
      if (g.theta > 1e-3 && g.theta < Math.PI - 1e-3) {
        const d = Math.abs(g.bearing - d3Bearing(a[0], a[1], b[0], b[1]));
        expect(Math.min(d, 2 * Math.PI - d)).toBeLessThan(1e-8);
      }
    }
  });

  it('a source due north has bearing 0, due east at the equator bearing 90 deg', () => {
    expect(greatCircle(10, 20, 40, 20).bearing).toBeCloseTo(0, 12);
    expect(greatCircle(0, 0, 0, 30).bearing / DEG).toBeCloseTo(90, 10);
    expect(greatCircle(0, 0, 0, 30).theta / DEG).toBeCloseTo(30, 10);
  });

  it('derivatives with respect to source lat/lon match central finite differences', () => {
    const rnd = seeded(11);
    const h = 1e-5;
    for (let k = 0; k < 200; k++) {
      const s = [170 * rnd() - 85, 360 * rnd() - 180];
      const q = [170 * rnd() - 85, 360 * rnd() - 180];
      const g = greatCircle(s[0], s[1], q[0], q[1]);
      if (g.theta < 0.05 || g.theta > Math.PI - 0.05) continue;
      const up = greatCircle(s[0], s[1], q[0] + h, q[1]);
      const dn = greatCircle(s[0], s[1], q[0] - h, q[1]);
      const ri = greatCircle(s[0], s[1], q[0], q[1] + h);
      const le = greatCircle(s[0], s[1], q[0], q[1] - h);
      const wrap = (x: number) => Math.atan2(Math.sin(x), Math.cos(x));
      expect(g.dThetaDLat).toBeCloseTo((up.theta - dn.theta) / (2 * h), 7);
      expect(g.dThetaDLon).toBeCloseTo((ri.theta - le.theta) / (2 * h), 7);
      expect(g.dBearingDLat).toBeCloseTo(wrap(up.bearing - dn.bearing) / (2 * h), 6);
      expect(g.dBearingDLon).toBeCloseTo(wrap(ri.bearing - le.bearing) / (2 * h), 6);
    }
  });

  it('destination() walks back onto the same great circle', () => {
    const p = destination(-12, 140, 1.1, 0.7);
    const g = greatCircle(-12, 140, p.lat, p.lon);
    expect(g.theta).toBeCloseTo(0.7, 12);
    expect(g.bearing).toBeCloseTo(1.1, 12);
  });
});
