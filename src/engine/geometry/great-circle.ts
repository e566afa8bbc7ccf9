/**
 * Great-circle distance and initial bearing from a station to a source on a
 * sphere, with partial derivatives with respect to the source position.
 *
 * With X = cos(phi2) sin(dLon), Y = cos(phi1) sin(phi2) - sin(phi1) cos(phi2) cos(dLon),
 * C = sin(phi1) sin(phi2) + cos(phi1) cos(phi2) cos(dLon):
 *   theta = atan2(hypot(X, Y), C),  bearing = atan2(X, Y)  (spherical trigonometry, e.g.
 *   Ed Williams, Aviation Formulary; the atan2 form stays accurate at small and large distances).
 */
import { DEG } from '../constants';

export type GreatCircle = {
  /** Angular distance station -> source, radians in [0, pi]. */
  theta: number;
  /** Initial bearing at the station towards the source, radians clockwise from north, in [0, 2 pi). */
  bearing: number;
  /** d theta / d(source latitude in degrees), radians per degree. */
  dThetaDLat: number;
  /** d theta / d(source longitude in degrees), radians per degree. */
  dThetaDLon: number;
  /** d bearing / d(source latitude in degrees), radians per degree. */
  dBearingDLat: number;
  /** d bearing / d(source longitude in degrees), radians per degree. */
  dBearingDLon: number;
};

export function greatCircle(stLatDeg: number, stLonDeg: number, srcLatDeg: number, srcLonDeg: number): GreatCircle {
  const out = {} as GreatCircle;
  greatCircleInto(stLatDeg, stLonDeg, srcLatDeg, srcLonDeg, out);
  return out;
}

/** Same as greatCircle, writing into a reusable object (no allocation). */
export function greatCircleInto(
  stLatDeg: number,
  stLonDeg: number,
  srcLatDeg: number,
  srcLonDeg: number,
  out: GreatCircle,
): void {
  const p1 = stLatDeg * DEG;
  const p2 = srcLatDeg * DEG;
  const dl = (srcLonDeg - stLonDeg) * DEG;
  const s1 = Math.sin(p1),
    c1 = Math.cos(p1);
  const s2 = Math.sin(p2),
    c2 = Math.cos(p2);
  const sdl = Math.sin(dl),
    cdl = Math.cos(dl);
  const X = c2 * sdl;
  const Y = c1 * s2 - s1 * c2 * cdl;
  const C = s1 * s2 + c1 * c2 * cdl;
  const q = X * X + Y * Y; // sin^2 theta
  const sinT = Math.sqrt(q);
  out.theta = Math.atan2(sinT, C);
  let b = Math.atan2(X, Y);
  if (b < 0) b += 2 * Math.PI;
  out.bearing = b;
  if (sinT === 0) {
    // Coincident or antipodal: direction undefined; report zero gradients.
    out.dThetaDLat = out.dThetaDLon = out.dBearingDLat = out.dBearingDLon = 0;
    return;
  }
  // dC/dphi2, dC/dlambda2; d theta = -dC / sin theta
  const dCdP = s1 * c2 - c1 * s2 * cdl;
  const dCdL = -c1 * c2 * sdl;
  out.dThetaDLat = (-dCdP / sinT) * DEG;
  out.dThetaDLon = (-dCdL / sinT) * DEG;
  // d atan2(X, Y) = (Y dX - X dY) / (X^2 + Y^2)
  const dXdP = -s2 * sdl;
  const dXdL = c2 * cdl;
  const dYdP = c1 * c2 + s1 * s2 * cdl;
  const dYdL = s1 * c2 * sdl;
  out.dBearingDLat = ((Y * dXdP - X * dYdP) / q) * DEG;
  out.dBearingDLon = ((Y * dXdL - X * dYdL) / q) * DEG;
}

/**
 * Destination point at angular distance `distance` (rad) along initial bearing `bearing` (rad)
 * from (latDeg, lonDeg) (spherical trigonometry, direct problem). Returns degrees, lon in (-180, 180].
 */
export function destination(latDeg: number, lonDeg: number, bearing: number, distance: number): { lat: number; lon: number } {
  const p1 = latDeg * DEG;
  const sp = Math.sin(p1) * Math.cos(distance) + Math.cos(p1) * Math.sin(distance) * Math.cos(bearing);
  const p2 = Math.asin(Math.max(-1, Math.min(1, sp)));
  const l = Math.atan2(Math.sin(bearing) * Math.sin(distance) * Math.cos(p1), Math.cos(distance) - Math.sin(p1) * sp);
  return { lat: p2 / DEG, lon: wrapLon(lonDeg + l / DEG) };
}

/** Longitude wrapped to (-180, 180]. */
export function wrapLon(lonDeg: number): number {
  let l = ((((lonDeg + 180) % 360) + 360) % 360) - 180;
  if (l === -180) l = 180;
  return l;
}
