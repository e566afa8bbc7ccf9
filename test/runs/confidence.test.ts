/**
 * Joint two-parameter confidence levels and contours. References: the chi-square distribution with
 * two degrees of freedom, P(chi2 <= x) = 1 - exp(-x/2), and the Delta chi2 table of Press et al.,
 * Numerical Recipes §15.6 (2.30 for 68.3 %, 6.18 for 95.4 %). For a quadratic misfit
 * chi2 = chi2_min + (x/sx)^2 + (y/sy)^2 the Delta chi2 = d contour is the ellipse with semi-axes
 * sqrt(d) sx and sqrt(d) sy.
 */
import { describe, expect, it } from 'vitest';
import { JOINT_2D, coverage2d, deltaChi2Contours } from '@/src/runs/confidence';

describe('joint 2-parameter levels', () => {
  it('2.30 and 6.18 cover 68.3 % and 95.4 %', () => {
    expect(coverage2d(JOINT_2D[0].deltaChi2)).toBeCloseTo(0.683, 3);
    expect(coverage2d(JOINT_2D[1].deltaChi2)).toBeCloseTo(0.954, 3);
  });
});

describe('deltaChi2Contours', () => {
  const sx = 2;
  const sy = 0.5;
  const x = Array.from({ length: 81 }, (_, i) => -8 + i * 0.2);
  const y = Array.from({ length: 61 }, (_, j) => -2 + j * (4 / 60));
  const misfit = y.map((yv) => x.map((xv) => 40 + (xv / sx) ** 2 + (yv / sy) ** 2));

  it('traces the ellipses of a quadratic misfit (to within 2 % of Delta chi2)', () => {
    const found = deltaChi2Contours({ x, y, misfit, minimum: 40 }, [2.3, 6.18]);
    for (const { deltaChi2, rings } of found) {
      expect(rings.length).toBe(1);
      expect(rings[0].length).toBeGreaterThan(20);
      for (const [a, b] of rings[0]) expect((a / sx) ** 2 + (b / sy) ** 2).toBeCloseTo(deltaChi2, 0);
      for (const [a, b] of rings[0]) expect(Math.abs((a / sx) ** 2 + (b / sy) ** 2 - deltaChi2) / deltaChi2).toBeLessThan(0.02);
    }
  });

  it('maps positions back along a logarithmic axis', () => {
    const lx = Array.from({ length: 61 }, (_, i) => 10 ** (3 + i * 0.05)); // 1e3 .. 1e6
    const m2 = y.map((yv) => lx.map((xv) => 10 + ((Math.log10(xv) - 4.5) / 0.4) ** 2 + (yv / sy) ** 2));
    const [c] = deltaChi2Contours({ x: lx, y, misfit: m2 }, [2.3], { x: true, y: false });
    const xs = c.rings[0].map(([a]) => Math.log10(a));
    expect(Math.max(...xs) - 4.5).toBeCloseTo(0.4 * Math.sqrt(2.3), 2);
    expect(4.5 - Math.min(...xs)).toBeCloseTo(0.4 * Math.sqrt(2.3), 2);
  });
});
