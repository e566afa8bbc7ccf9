/** Covariance error ellipses: every vertex satisfies x^T C^-1 x = k^2 (definition of the k-sigma contour, Numerical Recipes §15.6.5). */
import { describe, expect, it } from 'vitest';
import { covarianceEllipse } from '@/src/runs/ellipse';

function mahalanobis2(dx: number, dy: number, sLon: number, sLat: number, rho: number): number {
  const a = sLon * sLon,
    d = sLat * sLat,
    b = rho * sLat * sLon;
  const det = a * d - b * b;
  return (d * dx * dx - 2 * b * dx * dy + a * dy * dy) / det;
}

describe('covarianceEllipse', () => {
  it('puts every vertex on the k-sigma contour, correlated or not', () => {
    for (const [sLat, sLon, rho] of [
      [1, 2, 0],
      [2, 1, 0],
      [0.5, 1.5, 0.7],
      [1.2, 0.3, -0.9],
      [1, 1, 0.5],
    ]) {
      for (const k of [1, 2]) {
        for (const [x, y] of covarianceEllipse({ lat: 10, lon: 20 }, sLat, sLon, rho, k, 24)) {
          expect(mahalanobis2(x - 20, y - 10, sLon, sLat, rho)).toBeCloseTo(k * k, 9);
        }
      }
    }
  });

  it('has semi-axes k sLon and k sLat without correlation', () => {
    const pts = covarianceEllipse({ lat: 0, lon: 0 }, 1, 3, 0, 2, 4);
    expect(Math.max(...pts.map((p) => Math.abs(p[0])))).toBeCloseTo(6, 12);
    expect(Math.max(...pts.map((p) => Math.abs(p[1])))).toBeCloseTo(2, 12);
  });
});
