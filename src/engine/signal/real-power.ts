/**
 * Squared magnitudes |X_k|^2, k = 0 .. floor(n/2), of the DFT of a real
 * sequence of length n. For even n the sequence is packed into a complex one of
 * half length, z_j = x_2j + i x_2j+1, and split afterwards with
 * X_k = E_k + exp(-2 pi i k / n) O_k (the usual real-input packing, e.g.
 * Press et al., Numerical Recipes 3rd ed., 12.3).
 */
import { complexDft, type ComplexDft } from './complex-dft';

export interface RealPowerPlan {
  readonly n: number;
  /** Number of one-sided bins, floor(n/2) + 1. */
  readonly bins: number;
  /** Write |X_k|^2 of the real input (length n) into out (length bins). */
  power(input: Float64Array, out: Float64Array): void;
}

function evenPlan(n: number): RealPowerPlan {
  const h = n / 2;
  const dft: ComplexDft = complexDft(h);
  const packed = new Float64Array(2 * h);
  const z = new Float64Array(2 * h);
  const twCos = new Float64Array(h + 1);
  const twSin = new Float64Array(h + 1);
  for (let k = 0; k <= h; k++) {
    twCos[k] = Math.cos((2 * Math.PI * k) / n);
    twSin[k] = -Math.sin((2 * Math.PI * k) / n);
  }
  return {
    n,
    bins: h + 1,
    power(input, out) {
      for (let j = 0; j < h; j++) {
        packed[2 * j] = input[2 * j];
        packed[2 * j + 1] = input[2 * j + 1];
      }
      dft.forward(packed, z);
      for (let k = 0; k <= h; k++) {
        const a = k % h;
        const b = (h - k) % h;
        const zr = z[2 * a],
          zi = z[2 * a + 1];
        const wr = z[2 * b],
          wi = -z[2 * b + 1]; // conj(Z_{h-k})
        const er = 0.5 * (zr + wr),
          ei = 0.5 * (zi + wi);
        // O_k = (Z_k - conj(Z_{h-k})) / (2i)
        const dr = zr - wr,
          di = zi - wi;
        const or = 0.5 * di,
          oi = -0.5 * dr;
        const tr = twCos[k] * or - twSin[k] * oi;
        const ti = twCos[k] * oi + twSin[k] * or;
        const xr = er + tr,
          xi = ei + ti;
        out[k] = xr * xr + xi * xi;
      }
    },
  };
}

function oddPlan(n: number): RealPowerPlan {
  const dft = complexDft(n);
  const packed = new Float64Array(2 * n);
  const spec = new Float64Array(2 * n);
  const bins = (n - 1) / 2 + 1;
  return {
    n,
    bins,
    power(input, out) {
      for (let j = 0; j < n; j++) {
        packed[2 * j] = input[j];
        packed[2 * j + 1] = 0;
      }
      dft.forward(packed, spec);
      for (let k = 0; k < bins; k++) out[k] = spec[2 * k] * spec[2 * k] + spec[2 * k + 1] * spec[2 * k + 1];
    },
  };
}

const plans = new Map<number, RealPowerPlan>();

export function realPowerPlan(n: number): RealPowerPlan {
  if (!Number.isInteger(n) || n < 2) throw new RangeError(`segment length must be a whole number of at least 2, got ${n}`);
  let plan = plans.get(n);
  if (!plan) {
    plan = n % 2 === 0 ? evenPlan(n) : oddPlan(n);
    plans.set(n, plan);
  }
  return plan;
}
