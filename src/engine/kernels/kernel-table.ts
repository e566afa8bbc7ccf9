/**
 * Kernel tables: Ez and horizontal-B power per unit intensity on a theta grid
 * for every frequency of a band, interpolated in theta.
 *
 * Stored per grid node and frequency: g = ln(power) for Ez and g = ln(bh / sin^2 theta)
 * for B (regular at the antipode), each with g' and g'' from the analytic Legendre
 * derivatives (g' = 2 Re(X'/X), g'' = 2 Re(X''/X - (X'/X)^2)). Between nodes a quintic
 * Hermite polynomial in theta reproduces g, g', g'' at both ends (error O(h^6)).
 * Layout: data[((i * n) + j) * 6 + k], k = gE, h gE', h^2 gE'', gB, h gB', h^2 gB''.
 */
import { bandKey } from '../band';
import type { Cavity } from '../cavity/types';
import { LEGENDRE_OUT, legendreInto, prepareDegree } from '../special/legendre';
import { DEG } from '../constants';
import { KERNEL_CACHE_SIZE, KERNEL_GRID_STEP_DEG, KERNEL_MIN_THETA_DEG } from '../tolerances';
import { fieldFactors } from './field-constants';
import { createKernelSample, type KernelSample } from './kernel-sample';

export { createKernelSample, type KernelSample } from './kernel-sample';

export interface KernelTable {
  readonly freqs: Float64Array;
  /** number of frequency bins */
  readonly n: number;
  /** theta grid: first node, step, node count (radians) */
  readonly thetaMin: number;
  readonly step: number;
  readonly nodes: number;
  /** Fills out.ez, out.bh, out.dEz, out.dBh at angular distance theta (radians). No allocation. */
  sample(theta: number, out: KernelSample): void;
  /** Fills only out.ez and out.bh (no derivatives; cheaper, for misfit-only evaluations). */
  samplePower(theta: number, out: Pick<KernelSample, 'ez' | 'bh'>): void;
}

export type KernelTableOptions = { stepDeg: number; minThetaDeg: number };

export function resolveKernelTableOptions(o: Partial<KernelTableOptions> = {}): KernelTableOptions {
  return { stepDeg: o.stepDeg ?? KERNEL_GRID_STEP_DEG, minThetaDeg: o.minThetaDeg ?? KERNEL_MIN_THETA_DEG };
}

const cache = new Map<string, KernelTable>();

/** The kernel table of a cavity over a frequency grid, cached by cavity key + band + grid. */
export function getKernelTable(cavity: Cavity, freqs: Float64Array, options?: Partial<KernelTableOptions>): KernelTable {
  const o = resolveKernelTableOptions(options);
  const key = `${cavity.key}|${bandKey(freqs)}|${o.stepDeg}|${o.minThetaDeg}`;
  const hit = cache.get(key);
  if (hit) {
    cache.delete(key);
    cache.set(key, hit); // most recently used last
    return hit;
  }
  const table = buildKernelTable(cavity, freqs, o);
  cache.set(key, table);
  while (cache.size > KERNEL_CACHE_SIZE) cache.delete(cache.keys().next().value as string);
  return table;
}

export function buildKernelTable(cavity: Cavity, freqs: Float64Array, options?: Partial<KernelTableOptions>): KernelTable {
  const o = resolveKernelTableOptions(options);
  const thetaMin = o.minThetaDeg * DEG;
  const nodes = Math.max(2, Math.round((Math.PI - thetaMin) / (o.stepDeg * DEG)) + 1);
  const h = (Math.PI - thetaMin) / (nodes - 1);
  const n = freqs.length;
  const data = new Float64Array(nodes * n * 6);
  const L = new Float64Array(LEGENDRE_OUT);
  for (let j = 0; j < n; j++) {
    const nu = cavity.nu(freqs[j]);
    const { eFactor, bFactor } = fieldFactors(nu, freqs[j], cavity.radiusM, cavity.heightM);
    const lnE = Math.log(eFactor);
    const lnB = Math.log(bFactor);
    if (!Number.isFinite(lnE) || !Number.isFinite(lnB))
      throw new RangeError(
        `the cavity has no loss at ${freqs[j]} Hz (nu = ${nu.re} ${nu.im < 0 ? '-' : '+'} ${Math.abs(nu.im)}i sits on a resonance): fields are unbounded; give the propagation table a positive attenuation`,
      );
    const deg = prepareDegree(nu.re, nu.im);
    for (let i = 0; i < nodes; i++) {
      legendreInto(deg, i === nodes - 1 ? Math.PI : thetaMin + i * h, L);
      const at = (i * n + j) * 6;
      logDerivs(L[0], L[1], L[2], L[3], L[4], L[5], lnE, h, data, at);
      logDerivs(L[6], L[7], L[8], L[9], L[10], L[11], lnB, h, data, at + 3);
    }
  }
  return makeTable(freqs, data, thetaMin, h, nodes);
}

/** ln|X|^2 + lnK, h * 2 Re(X'/X), h^2 * 2 Re(X''/X - (X'/X)^2) into data[at..at+2]. */
function logDerivs(xr: number, xi: number, dr: number, di: number, d2r: number, d2i: number, lnK: number, h: number, data: Float64Array, at: number): void {
  const m = xr * xr + xi * xi;
  // r1 = X'/X, r2 = X''/X
  const r1r = (dr * xr + di * xi) / m;
  const r1i = (di * xr - dr * xi) / m;
  const r2r = (d2r * xr + d2i * xi) / m;
  data[at] = lnK + Math.log(m);
  data[at + 1] = h * 2 * r1r;
  data[at + 2] = h * h * 2 * (r2r - (r1r * r1r - r1i * r1i));
}

function makeTable(freqs: Float64Array, data: Float64Array, thetaMin: number, h: number, nodes: number): KernelTable {
  const n = freqs.length;
  const thetaMax = Math.PI;
  const stride = n * 6;
  const invH = 1 / h;
  return {
    freqs,
    n,
    thetaMin,
    step: h,
    nodes,
    sample(theta: number, out: KernelSample): void {
      let clamped = false;
      if (!(theta > thetaMin)) { theta = thetaMin; clamped = true; }
      else if (theta > thetaMax) { theta = thetaMax; clamped = true; }
      const u = (theta - thetaMin) * invH;
      let i = Math.floor(u);
      if (i > nodes - 2) i = nodes - 2;
      const t = u - i;
      const t2 = t * t, t3 = t2 * t, t4 = t3 * t, t5 = t4 * t;
      // quintic Hermite basis (values) and their t-derivatives
      const h0 = 1 - 10 * t3 + 15 * t4 - 6 * t5, h1 = t - 6 * t3 + 8 * t4 - 3 * t5, h2 = 0.5 * (t2 - 3 * t3 + 3 * t4 - t5);
      const h3 = 10 * t3 - 15 * t4 + 6 * t5, h4 = -4 * t3 + 7 * t4 - 3 * t5, h5 = 0.5 * (t3 - 2 * t4 + t5);
      const dScale = clamped ? 0 : invH;
      const q0 = (-30 * t2 + 60 * t3 - 30 * t4) * dScale, q1 = (1 - 18 * t2 + 32 * t3 - 15 * t4) * dScale;
      const q2 = 0.5 * (2 * t - 9 * t2 + 12 * t3 - 5 * t4) * dScale, q3 = -q0;
      const q4 = (-12 * t2 + 28 * t3 - 15 * t4) * dScale, q5 = 0.5 * (3 * t2 - 8 * t3 + 5 * t4) * dScale;
      const s = Math.sin(theta);
      const s2 = s * s;
      const s2d = clamped ? 0 : 2 * s * Math.cos(theta);
      const { ez, bh, dEz, dBh } = out;
      let a = i * stride;
      for (let j = 0; j < n; j++, a += 6) {
        const b = a + stride;
        const e0 = data[a], e1 = data[a + 1], e2 = data[a + 2], f0 = data[b], f1 = data[b + 1], f2 = data[b + 2];
        const g0 = data[a + 3], g1 = data[a + 4], g2 = data[a + 5], k0 = data[b + 3], k1 = data[b + 4], k2 = data[b + 5];
        const ge = h0 * e0 + h1 * e1 + h2 * e2 + h3 * f0 + h4 * f1 + h5 * f2;
        const gep = q0 * e0 + q1 * e1 + q2 * e2 + q3 * f0 + q4 * f1 + q5 * f2;
        const gb = h0 * g0 + h1 * g1 + h2 * g2 + h3 * k0 + h4 * k1 + h5 * k2;
        const gbp = q0 * g0 + q1 * g1 + q2 * g2 + q3 * k0 + q4 * k1 + q5 * k2;
        const pe = Math.exp(ge);
        const pb = Math.exp(gb);
        ez[j] = pe;
        dEz[j] = pe * gep;
        bh[j] = pb * s2;
        dBh[j] = pb * (s2 * gbp + s2d);
      }
    },
    samplePower(theta: number, out: Pick<KernelSample, 'ez' | 'bh'>): void {
      if (!(theta > thetaMin)) theta = thetaMin;
      else if (theta > thetaMax) theta = thetaMax;
      const u = (theta - thetaMin) * invH;
      let i = Math.floor(u);
      if (i > nodes - 2) i = nodes - 2;
      const t = u - i;
      const t2 = t * t, t3 = t2 * t, t4 = t3 * t, t5 = t4 * t;
      const h0 = 1 - 10 * t3 + 15 * t4 - 6 * t5, h1 = t - 6 * t3 + 8 * t4 - 3 * t5, h2 = 0.5 * (t2 - 3 * t3 + 3 * t4 - t5);
      const h3 = 10 * t3 - 15 * t4 + 6 * t5, h4 = -4 * t3 + 7 * t4 - 3 * t5, h5 = 0.5 * (t3 - 2 * t4 + t5);
      const s = Math.sin(theta);
      const s2 = s * s;
      const { ez, bh } = out;
      let a = i * stride;
      for (let j = 0; j < n; j++, a += 6) {
        const b = a + stride;
        ez[j] = Math.exp(h0 * data[a] + h1 * data[a + 1] + h2 * data[a + 2] + h3 * data[b] + h4 * data[b + 1] + h5 * data[b + 2]);
        bh[j] = s2 * Math.exp(h0 * data[a + 3] + h1 * data[a + 4] + h2 * data[a + 5] + h3 * data[b + 3] + h4 * data[b + 4] + h5 * data[b + 5]);
      }
    },
  };
}

/** Empties the in-process table cache (tests, memory pressure). */
export function clearKernelTableCache(): void {
  cache.clear();
}
