/**
 * Fit-free mode parameters of a predicted spectrum: the Lorentzian through
 * three bins. For L(f) = A / (1 + ((f - f0) / g)^2), 1/L is a quadratic in f
 * (1/L = (1 + (f - f0)^2 / g^2) / A), so the parabola through 1/P at
 * f_c - s, f_c, f_c + s gives f0 = f_c - b / (2c), A = 1 / q0 and g = sqrt(q0 / c),
 * with q(u) = a + b u + c u^2 and q0 = a - b^2 / (4c) its minimum. Exact for a
 * Lorentzian; the bins are fixed (f_c nearest the observed mode, s about the
 * observed half-width), so the estimate is a smooth function of the spectrum.
 *
 * Where the three bins make no clear peak (a dip or a slope: c <= 0, or a
 * vertex so far off or so sharp that c or q0 nearly vanish) the formulas above
 * blow up. The curvature c and the vertex q0 are therefore floored smoothly
 * (C1) at fixed fractions of a = 1/P(f_c): below twice the floor, x becomes
 * m (1 + exp(x/m - 2)), which meets x with equal slope at x = 2m and tends to
 * m. Every output is then finite for any positive powers, the estimate is
 * exact wherever the floors are inactive (c >= 2 c_min, q0 >= 2 q_min), and
 * with no peak the mode reads as one far off towards the rising side (a large
 * but finite frequency residual whose slope still points the way).
 * Also returns the derivatives of (f0, ln A, g) with respect to the three
 * powers, for the chain rule.
 */
import { THREE_POINT_CURVATURE_FLOOR, THREE_POINT_VERTEX_FLOOR } from '@/src/engine/tolerances';

export interface ThreePointMode {
  frequency: number;
  lnIntensity: number;
  halfWidth: number;
  /** d(frequency, lnIntensity, halfWidth) / d(P_minus, P_centre, P_plus), row-major 3 x 3. */
  grad: Float64Array;
  /** True when the three bins make a clear peak and the estimate is the exact three-point Lorentzian (no floor active). */
  ok: boolean;
}

/** Smooth floor x -> x (x >= 2m), m (1 + exp(x/m - 2)) below; returns value and d/dx, d/dm. */
function floorC1(x: number, m: number): [number, number, number] {
  if (x >= 2 * m) return [x, 1, 0];
  const e = Math.exp(x / m - 2);
  return [m * (1 + e), e, 1 + e - (x / m) * e];
}

export function lorentzThreePoint(fc: number, s: number, pMinus: number, p0: number, pPlus: number, out?: ThreePointMode): ThreePointMode {
  const o = out ?? { frequency: NaN, lnIntensity: NaN, halfWidth: NaN, grad: new Float64Array(9), ok: false };
  // Powers must be positive; a zero or negative bin (never from positive sources) is lifted to a tiny positive value.
  const pMax = Math.max(pMinus, p0, pPlus);
  const lift = (p: number) => (p > 0 && Number.isFinite(p) ? p : 1e-12 * pMax);
  const raw = [pMinus, p0, pPlus];
  const P = raw.map(lift);
  const y = [1 / P[0], 1 / P[1], 1 / P[2]];
  const a = y[1];
  const b = (y[2] - y[0]) / (2 * s);
  const c = (y[2] - 2 * y[1] + y[0]) / (2 * s * s);
  const dA = [0, 1, 0];
  const dB = [-1 / (2 * s), 0, 1 / (2 * s)];
  const dC = [1 / (2 * s * s), -1 / (s * s), 1 / (2 * s * s)];
  const kc = THREE_POINT_CURVATURE_FLOOR / (s * s);
  const [ce, ceX, ceM] = floorC1(c, kc * a);
  const q = a - (b * b) / (4 * ce);
  const kq = THREE_POINT_VERTEX_FLOOR;
  const [qe, qeX, qeM] = floorC1(q, kq * a);
  const u0 = -b / (2 * ce);
  const g = Math.sqrt(qe / ce);
  o.ok = ceX === 1 && ceM === 0 && qeX === 1 && qeM === 0;
  o.frequency = fc + u0;
  o.lnIntensity = -Math.log(qe);
  o.halfWidth = g;
  for (let i = 0; i < 3; i++) {
    const dce = ceX * dC[i] + ceM * kc * dA[i];
    const du0 = -dB[i] / (2 * ce) + (b * dce) / (2 * ce * ce);
    const dq = dA[i] - (b * dB[i]) / (2 * ce) + (b * b * dce) / (4 * ce * ce);
    const dqe = qeX * dq + qeM * kq * dA[i];
    const dyDp = -y[i] * y[i];
    const lifted = P[i] === raw[i] ? 1 : 0;
    o.grad[i] = du0 * dyDp * lifted;
    o.grad[3 + i] = (-dqe / qe) * dyDp * lifted;
    o.grad[6 + i] = (g / 2) * (dqe / qe - dce / ce) * dyDp * lifted;
  }
  return o;
}
