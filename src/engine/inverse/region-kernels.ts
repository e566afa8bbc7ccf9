/**
 * Effective kernels of a region seen from one station: the power per unit
 * intensity of each component summed over the region's quadrature nodes,
 * E_c = sum_q w_q K_c(theta_q) proj_c(bearing_q) (Ez: ez; Bns: bh sin^2 b;
 * Bew: bh cos^2 b), and their derivatives with respect to the region's centre
 * through each node's own dependence on the centre (spotNodesInto) and
 * greatCircle's dtheta and dbearing; the spread derivative of a spot by a
 * central difference. Allocation-free after set-up.
 */
import { greatCircleInto, type GreatCircle } from '@/src/engine/geometry/great-circle';
import { SPOT_MAX_NODES, SPOT_STRIDE, spotNodesInto } from '@/src/engine/sources/spot';
import { SPREAD_DIFF_STEP_DEG } from '@/src/engine/tolerances';
import { createKernelBuffers, type KernelBuffers, type KernelSampler } from './kernel-sampler';

/** Samples every node into bufs/gcs and writes E_Ez, E_Bns, E_Bew into out[0..2]. */
export function effectiveKernels(
  kernel: KernelSampler,
  station: { lat: number; lon: number },
  nodes: Float64Array,
  count: number,
  bufs: KernelBuffers[],
  gcs: GreatCircle[],
  out: Float64Array[],
): void {
  const nb = kernel.n;
  out[0].fill(0);
  out[1].fill(0);
  out[2].fill(0);
  for (let q = 0; q < count; q++) {
    const o = q * SPOT_STRIDE;
    const g = gcs[q];
    const kb = bufs[q];
    greatCircleInto(station.lat, station.lon, nodes[o], nodes[o + 1], g);
    kernel.sample(g.theta, kb);
    const w = nodes[o + 2];
    const sn = w * Math.sin(g.bearing) ** 2;
    const cs = w * Math.cos(g.bearing) ** 2;
    for (let k = 0; k < nb; k++) {
      out[0][k] += w * kb.ez[k];
      out[1][k] += sn * kb.bh[k];
      out[2][k] += cs * kb.bh[k];
    }
  }
}

/** d E_component / d(centre lat), d(centre lon), per degree, from the samples of effectiveKernels. */
export function centreDerivatives(
  nodes: Float64Array,
  count: number,
  gcs: GreatCircle[],
  bufs: KernelBuffers[],
  component: number,
  dLat: Float64Array,
  dLon: Float64Array,
): void {
  const nb = dLat.length;
  dLat.fill(0);
  dLon.fill(0);
  for (let q = 0; q < count; q++) {
    const o = q * SPOT_STRIDE;
    const w = nodes[o + 2];
    const g = gcs[q];
    const kb = bufs[q];
    // chain rule through the node position: d(node lat, lon)/d(centre lat, lon)
    const tLat = g.dThetaDLat * nodes[o + 3] + g.dThetaDLon * nodes[o + 5];
    const tLon = g.dThetaDLat * nodes[o + 4] + g.dThetaDLon * nodes[o + 6];
    const bLat = g.dBearingDLat * nodes[o + 3] + g.dBearingDLon * nodes[o + 5];
    const bLon = g.dBearingDLat * nodes[o + 4] + g.dBearingDLon * nodes[o + 6];
    const sb = Math.sin(g.bearing);
    const cb = Math.cos(g.bearing);
    const proj = component === 0 ? 1 : component === 1 ? sb * sb : cb * cb;
    const dProj = component === 0 ? 0 : component === 1 ? 2 * sb * cb : -2 * sb * cb;
    const K = component === 0 ? kb.ez : kb.bh;
    const dK = component === 0 ? kb.dEz : kb.dBh;
    for (let k = 0; k < nb; k++) {
      dLat[k] += w * (dK[k] * tLat * proj + K[k] * dProj * bLat);
      dLon[k] += w * (dK[k] * tLon * proj + K[k] * dProj * bLon);
    }
  }
}

/** Scratch of spreadDerivative: one spot's nodes, kernel samples and geometry. */
export interface SpotScratch {
  nodes: Float64Array;
  bufs: KernelBuffers[];
  gcs: GreatCircle[];
}

export function createSpotScratch(nb: number): SpotScratch {
  return {
    nodes: new Float64Array(SPOT_MAX_NODES * SPOT_STRIDE),
    bufs: Array.from({ length: SPOT_MAX_NODES }, () => createKernelBuffers(nb)),
    gcs: Array.from({ length: SPOT_MAX_NODES }, () => ({}) as GreatCircle),
  };
}

/**
 * d E_c / d(spread) of a spot centred at (lat, lon) with the given spread, by a central difference of step
 * SPREAD_DIFF_STEP_DEG (one-sided at spread 0): into plus[c]; minus[c] is overwritten as scratch.
 */
export function spreadDerivative(
  kernel: KernelSampler,
  station: { lat: number; lon: number },
  lat: number,
  lon: number,
  spread: number,
  s: SpotScratch,
  plus: Float64Array[],
  minus: Float64Array[],
): void {
  const lo = Math.max(0, spread - SPREAD_DIFF_STEP_DEG);
  const hi = spread + SPREAD_DIFF_STEP_DEG;
  effectiveKernels(kernel, station, s.nodes, spotNodesInto(lat, lon, hi, s.nodes), s.bufs, s.gcs, plus);
  effectiveKernels(kernel, station, s.nodes, spotNodesInto(lat, lon, lo, s.nodes), s.bufs, s.gcs, minus);
  const width = hi - lo;
  for (let c = 0; c < 3; c++) {
    const a = plus[c];
    const b = minus[c];
    for (let k = 0; k < a.length; k++) a[k] = (a[k] - b[k]) / width;
  }
}
