/**
 * Error ellipse of a source centre from its latitude/longitude covariance
 * [[sLat^2, rho sLat sLon], [rho sLat sLon, sLon^2]]: the k-sigma contour
 * x^T C^-1 x = k^2 (e.g. Press et al., Numerical Recipes 3rd ed. §15.6.5).
 * Returns polygon vertices [lon, lat] in degrees around the centre.
 */
export function covarianceEllipse(
  centre: { lat: number; lon: number },
  sLat: number,
  sLon: number,
  rho: number,
  k: number,
  vertices = 72,
): [number, number][] {
  const a = sLon * sLon;
  const d = sLat * sLat;
  const b = rho * sLat * sLon;
  // Eigen-decomposition of the symmetric 2x2 matrix [[a, b], [b, d]] in (lon, lat).
  const tr = (a + d) / 2;
  const disc = Math.sqrt(Math.max(0, ((a - d) / 2) ** 2 + b * b));
  const l1 = tr + disc;
  const l2 = Math.max(0, tr - disc);
  const angle = b === 0 && a >= d ? 0 : b === 0 ? Math.PI / 2 : Math.atan2(l1 - a, b);
  const c = Math.cos(angle);
  const s = Math.sin(angle);
  const r1 = k * Math.sqrt(l1);
  const r2 = k * Math.sqrt(l2);
  const out: [number, number][] = [];
  for (let i = 0; i <= vertices; i++) {
    const t = (2 * Math.PI * i) / vertices;
    const u = r1 * Math.cos(t);
    const v = r2 * Math.sin(t);
    out.push([centre.lon + c * u - s * v, centre.lat + s * u + c * v]);
  }
  return out;
}
