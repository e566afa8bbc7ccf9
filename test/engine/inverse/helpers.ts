/** Shared helpers of the inverter tests: central finite differences and a smooth analytic kernel. */
import type { KernelBuffers, KernelSampler } from '@/src/engine/inverse/kernel-sampler';
import type { LeastSquaresProblem } from '@/src/engine/optim/types';

/**
 * A smooth stand-in kernel with exact theta-derivatives (for chain-rule checks only):
 * ez = exp(-theta f/40) (2 + sin(3 theta + f/7)), bh = exp(-theta f/55) (2 + cos(2 theta - f/9)).
 */
export function analyticKernel(freqs: Float64Array): KernelSampler {
  return {
    n: freqs.length,
    freqs,
    sample(theta: number, out: KernelBuffers) {
      for (let k = 0; k < freqs.length; k++) {
        const f = freqs[k];
        const a = Math.exp((-theta * f) / 40);
        const s = 2 + Math.sin(3 * theta + f / 7);
        out.ez[k] = 1e-12 * a * s;
        out.dEz[k] = 1e-12 * a * ((-f / 40) * s + 3 * Math.cos(3 * theta + f / 7));
        const b = Math.exp((-theta * f) / 55);
        const c = 2 + Math.cos(2 * theta - f / 9);
        out.bh[k] = 1e-24 * b * c;
        out.dBh[k] = 1e-24 * b * ((-f / 55) * c - 2 * Math.sin(2 * theta - f / 9));
      }
    },
  };
}

/** Central finite-difference Jacobian (row-major), step h_j = rel (1 + |p_j|). */
export function centralDifferenceJacobian(problem: LeastSquaresProblem, p: Float64Array, rel = 1e-6): Float64Array {
  const { nParams: n, nResiduals: m } = problem;
  const out = new Float64Array(m * n);
  const plus = new Float64Array(m);
  const minus = new Float64Array(m);
  for (let j = 0; j < n; j++) {
    const h = rel * (1 + Math.abs(p[j]));
    const q = Float64Array.from(p);
    q[j] = p[j] + h;
    problem.residuals(q, plus);
    q[j] = p[j] - h;
    problem.residuals(q, minus);
    for (let i = 0; i < m; i++) out[i * n + j] = (plus[i] - minus[i]) / (2 * h);
  }
  return out;
}

/** Largest |a - b| relative to the largest |b| in the same column. */
export function maxColumnRelativeError(a: Float64Array, b: Float64Array, m: number, n: number): number {
  let worst = 0;
  for (let j = 0; j < n; j++) {
    let scale = 0;
    for (let i = 0; i < m; i++) scale = Math.max(scale, Math.abs(b[i * n + j]));
    for (let i = 0; i < m; i++) worst = Math.max(worst, Math.abs(a[i * n + j] - b[i * n + j]) / (scale || 1));
  }
  return worst;
}

import { syntheticObserved as observedFor, type SyntheticSource } from '@/src/engine/inverse/synthetic';
import type { ObservedSeries, StationSite } from '@/src/engine/inverse/types';

export const LINEAR_CAVITY = { model: 'linear' as const, earthRadiusKm: 6371, heightKm: 60 };

/** Spectra from the engine's kernel tables for point sources in the linear cavity, with seeded log-normal noise sigma. */
export function syntheticObserved(
  stations: StationSite[],
  sources: SyntheticSource[],
  freqs: Float64Array,
  sigma: number,
  seed: number,
): ObservedSeries[] {
  return observedFor(LINEAR_CAVITY, stations, sources, freqs, sigma, seed);
}

/**
 * The invented four-station world of the mode-parameter tests: one source region R1 to find,
 * its truth, and the 3-36 Hz model grid at 0.1 Hz. Station codes start with `prefix`.
 */
export function modeTestWorld(prefix: string) {
  const band = { minHz: 3, maxHz: 36, stepHz: 0.1 };
  return {
    stations: [
      [40, -5],
      [-40, 95],
      [5, 75],
      [60, 40],
    ].map(([lat, lon], i) => ({ code: `${prefix}${i + 1}`, lat, lon })),
    band,
    freqs: Float64Array.from({ length: 331 }, (_, i) => band.minHz + band.stepHz * i),
    truth: { lat: 6, lon: 24, intensity: 3e4 },
    unknowns: [{ name: 'R1', intensity: { min: 1e3, max: 1e6 }, lat: { min: -20, max: 25 }, lon: { min: 0, max: 50 } }],
  };
}
