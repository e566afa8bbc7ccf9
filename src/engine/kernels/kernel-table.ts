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
import { KERNEL_CACHE_BYTES, KERNEL_CACHE_SIZE, KERNEL_GRID_STEP_DEG, KERNEL_MIN_THETA_DEG } from '../tolerances';
import { fieldFactors } from './field-constants';
import type { KernelTable } from './kernel-sample';
import { createHermiteSampler } from './hermite-sampler';

export { createKernelSample, type KernelSample, type KernelTable } from './kernel-sample';

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
  // evict least recently used tables beyond the count or memory budget (always keep the newest)
  const bytes = () => [...cache.values()].reduce((a, t) => a + t.nodes * t.n * 48, 0);
  while (cache.size > 1 && (cache.size > KERNEL_CACHE_SIZE || bytes() > KERNEL_CACHE_BYTES))
    cache.delete(cache.keys().next().value as string);
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
  return createHermiteSampler(freqs, data, thetaMin, h, nodes);
}

/** ln|X|^2 + lnK, h * 2 Re(X'/X), h^2 * 2 Re(X''/X - (X'/X)^2) into data[at..at+2]. */
function logDerivs(
  xr: number,
  xi: number,
  dr: number,
  di: number,
  d2r: number,
  d2i: number,
  lnK: number,
  h: number,
  data: Float64Array,
  at: number,
): void {
  const m = xr * xr + xi * xi;
  // r1 = X'/X, r2 = X''/X
  const r1r = (dr * xr + di * xi) / m;
  const r1i = (di * xr - dr * xi) / m;
  const r2r = (d2r * xr + d2i * xi) / m;
  data[at] = lnK + Math.log(m);
  data[at + 1] = h * 2 * r1r;
  data[at + 2] = h * h * 2 * (r2r - (r1r * r1r - r1i * r1i));
}

/** Empties the in-process table cache (tests, memory pressure). */
export function clearKernelTableCache(): void {
  cache.clear();
}
