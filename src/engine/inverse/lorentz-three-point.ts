/**
 * Fit-free mode parameters of a predicted spectrum: the Lorentzian through
 * three bins. For L(f) = A / (1 + ((f - f0) / g)^2), 1/L is a quadratic in f
 * (1/L = (1 + (f - f0)^2 / g^2) / A), so the parabola through 1/P at
 * f_c - s, f_c, f_c + s gives f0 = f_c - b / (2c), A = 1 / q0 and g = sqrt(q0 / c),
 * with q(u) = a + b u + c u^2 and q0 = a - b^2 / (4c) its minimum. Exact for a
 * Lorentzian; the bins are fixed (f_c nearest the observed mode, s about the
 * observed half-width), so the estimate is a smooth function of the spectrum.
 * Also returns the derivatives of (f0, ln A, g) with respect to the three
 * powers, for the chain rule.
 */
export interface ThreePointMode {
  frequency: number;
  lnIntensity: number;
  halfWidth: number;
  /** d(frequency, lnIntensity, halfWidth) / d(P_minus, P_centre, P_plus), row-major 3 x 3. */
  grad: Float64Array;
  /** False when the three bins do not make a peak (c <= 0 or q0 <= 0). */
  ok: boolean;
}

export function lorentzThreePoint(fc: number, s: number, pMinus: number, p0: number, pPlus: number, out?: ThreePointMode): ThreePointMode {
  const o = out ?? { frequency: NaN, lnIntensity: NaN, halfWidth: NaN, grad: new Float64Array(9), ok: false };
  const ym = 1 / pMinus, y0 = 1 / p0, yp = 1 / pPlus;
  const a = y0;
  const b = (yp - ym) / (2 * s);
  const c = (yp - 2 * y0 + ym) / (2 * s * s);
  const q0 = a - (b * b) / (4 * c);
  o.ok = c > 0 && q0 > 0 && Number.isFinite(q0);
  if (!o.ok) {
    o.frequency = o.lnIntensity = o.halfWidth = NaN;
    o.grad.fill(NaN);
    return o;
  }
  const u0 = -b / (2 * c);
  const g = Math.sqrt(q0 / c);
  o.frequency = fc + u0;
  o.lnIntensity = -Math.log(q0);
  o.halfWidth = g;
  // derivatives with respect to y = 1/P, then dy/dP = -1/P^2
  const dB = [-1 / (2 * s), 0, 1 / (2 * s)];
  const dC = [1 / (2 * s * s), -1 / (s * s), 1 / (2 * s * s)];
  const dA = [0, 1, 0];
  const dyDp = [-ym * ym, -y0 * y0, -yp * yp];
  for (let i = 0; i < 3; i++) {
    const du0 = -dB[i] / (2 * c) + (b * dC[i]) / (2 * c * c);
    const dq0 = dA[i] - (b * dB[i]) / (2 * c) + (b * b * dC[i]) / (4 * c * c);
    o.grad[i] = du0 * dyDp[i];
    o.grad[3 + i] = (-dq0 / q0) * dyDp[i];
    o.grad[6 + i] = (g / 2) * (dq0 / q0 - dC[i] / c) * dyDp[i];
  }
  return o;
}
