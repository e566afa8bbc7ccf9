/**
 * Moving spot regions: a uniform cap of angular radius R around a centre, integrated by
 * Radon's 7-point rule for the disc (exact for polynomials of degree 5; Stroud 1971,
 * "Approximate Calculation of Multiple Integrals", formula S2:5-1): the centre with weight
 * 1/4 and six points at radius sqrt(2/3) R, 60 degrees apart, weight 1/8 each.
 * Nodes sit at fixed bearings from local north of the centre, so they move rigidly
 * (a rotation of the sphere) with it. Each node carries the derivatives of its lat/lon
 * with respect to the centre's lat/lon, for Jacobians. Spread 0 gives the point itself.
 */
import { DEG } from '../constants';
import { wrapLon } from '../geometry/great-circle';

export type SpotNode = {
  lat: number;
  lon: number;
  weight: number;
  /** d(node lat)/d(centre lat), d(node lat)/d(centre lon) (= 0), d(node lon)/d(centre lat), d(node lon)/d(centre lon) (= 1) */
  dLatDLat: number;
  dLatDLon: number;
  dLonDLat: number;
  dLonDLon: number;
};

export const SPOT_MAX_NODES = 7;
/** Doubles per node in spotNodesInto's output: lat, lon, weight, dLatDLat, dLatDLon, dLonDLat, dLonDLon. */
export const SPOT_STRIDE = 7;
const RING = Math.sqrt(2 / 3);

/**
 * Writes the quadrature nodes of a spot into out (SPOT_STRIDE doubles per node) and
 * returns the node count (1 for spread 0, else 7). No allocation.
 */
export function spotNodesInto(centerLat: number, centerLon: number, spreadDeg: number, out: Float64Array): number {
  if (!(spreadDeg > 0)) {
    out[0] = centerLat;
    out[1] = centerLon;
    out[2] = 1;
    out[3] = 1;
    out[4] = 0;
    out[5] = 0;
    out[6] = 1;
    return 1;
  }
  const r = RING * spreadDeg * DEG;
  const p = centerLat * DEG;
  const sp = Math.sin(p),
    cp = Math.cos(p),
    sr = Math.sin(r),
    cr = Math.cos(r);
  out[0] = centerLat;
  out[1] = centerLon;
  out[2] = 0.25;
  out[3] = 1;
  out[4] = 0;
  out[5] = 0;
  out[6] = 1;
  for (let k = 0; k < 6; k++) {
    const az = (k * Math.PI) / 3;
    const ca = Math.cos(az),
      sa = Math.sin(az);
    // destination point (spherical trigonometry, direct problem)
    const sLat = sp * cr + cp * sr * ca;
    const lat = Math.asin(sLat);
    const cLat = Math.cos(lat);
    // Longitude offset in the four-part form atan2(sin az sin r, cos p cos r - sin p sin r cos az):
    // the usual atan2(sin az sin r cos p, cos r - sin p sin(lat)) with the common factor cos p
    // taken out of both arguments, so that it stays defined at a pole (cos p = 0), where the
    // nodes then spread round the pole instead of collapsing onto one meridian.
    const A = sa * sr;
    const B = cp * cr - sp * sr * ca;
    const dl = Math.atan2(A, B);
    // derivatives with respect to the centre latitude (radians), then per degree (ratios stay)
    const dLat = B / cLat;
    const dB = -sp * cr - cp * sr * ca; // dA/dp = 0
    const dLon = (-A * dB) / (A * A + B * B);
    const o = (k + 1) * SPOT_STRIDE;
    out[o] = lat / DEG;
    out[o + 1] = wrapLon(centerLon + dl / DEG);
    out[o + 2] = 0.125;
    out[o + 3] = dLat;
    out[o + 4] = 0;
    out[o + 5] = dLon;
    out[o + 6] = 1;
  }
  return SPOT_MAX_NODES;
}

/** The quadrature nodes of a spot as objects (allocates; use spotNodesInto in hot loops). */
export function spotNodes(centerLat: number, centerLon: number, spreadDeg: number): SpotNode[] {
  const buf = new Float64Array(SPOT_MAX_NODES * SPOT_STRIDE);
  const count = spotNodesInto(centerLat, centerLon, spreadDeg, buf);
  const nodes: SpotNode[] = [];
  for (let k = 0; k < count; k++) {
    const o = k * SPOT_STRIDE;
    nodes.push({
      lat: buf[o],
      lon: buf[o + 1],
      weight: buf[o + 2],
      dLatDLat: buf[o + 3],
      dLatDLon: buf[o + 4],
      dLonDLat: buf[o + 5],
      dLonDLon: buf[o + 6],
    });
  }
  return nodes;
}
