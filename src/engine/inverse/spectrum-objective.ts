/**
 * The spectrum misfit as a least-squares problem: residual per kept bin
 * r = (ln P_pred - ln P_obs) / sigmaLog ('log'; or (P_pred / P_obs - 1) / sigmaLog,
 * 'linear', used to check against linear least squares; or the bare model
 * P_pred / (sigma P_obs), 'power', for derived objectives).
 *
 * P_pred = sum_r I_r E_c,r with the effective kernel of region r
 * E_c,r = sum_q w_q K_c(theta_q) proj_c(bearing_q) over its nodes q (one node
 * for a point region; the engine's 7-node spot quadrature, moving rigidly with
 * the centre, for a region with a spread; the given nodes of a fixed footprint,
 * e.g. one per grid cell). Regions that cannot move or change shape are sampled
 * once, as their kernels never change. K_Ez = ez, K_Bns = bh sin^2(bearing),
 * K_Bew = bh cos^2(bearing). Analytic Jacobian by the chain rule:
 * d/d(ln I) = I E; d/d(centre lat) = I sum_q w_q (dK/dtheta dtheta/dlat proj
 * + K dproj/dbearing dbearing/dlat), with the node's own dependence on the
 * centre (spotNodesInto's derivatives); the same for lon; dproj/dbearing is
 * sin(2b) for Bns and -sin(2b) for Bew. The spread derivative is a central
 * difference of the effective kernel (SPREAD_DIFF_STEP_DEG).
 * A series with correlated bins (Welch statistics) has its residuals and
 * Jacobian columns whitened (bin-whitening.ts): chi2 = r^T C^-1 r. The Jacobian
 * is computed by columns (contiguous per series) from the samples the residuals
 * left behind, so the optimiser needs no transpose; the row-major form is its
 * transpose.
 */
import type { GreatCircle } from '@/src/engine/geometry/great-circle';
import type { LeastSquaresProblem } from '@/src/engine/optim/types';
import { SPOT_MAX_NODES, SPOT_STRIDE, spotNodesInto } from '@/src/engine/sources/spot';
import { transposeInto } from '@/src/engine/optim/normal-equations';
import type { DataLayout } from './data-layout';
import { whitenColumns, whitenResiduals } from './bin-whitening';
import { centreDerivatives, createSpotScratch, effectiveKernels, spreadDerivative } from './region-kernels';
import { InversionInputError } from './errors';
import { createKernelBuffers, type KernelBuffers, type KernelSampler } from './kernel-sampler';
import { regionValue, type Parameterisation } from './parameters';
import { linearStartIntensities } from './linear-intensities';

/** 'log': ln-power misfit; 'linear': relative power misfit; 'power': r = P / (sigma P_obs), the bare model (for derived objectives). */
export type MisfitScale = 'log' | 'linear' | 'power';

export interface SpectrumProblem extends LeastSquaresProblem {
  nData: number;
  /** The Jacobian column-major (out[j * nResiduals + i]), as the optimiser takes it. */
  jacobianColumns(p: Float64Array, out: Float64Array): void;
  /** Predicted power per residual at the last evaluated point. */
  predicted: Float64Array;
  /**
   * Replace the free intensities of a start point by the bounded linear least-squares
   * fit of the relative power misfit for its centres (P is linear in the intensities),
   * so that LM starts with the right intensity scale.
   */
  refineStart(p: Float64Array): void;
}

export function spectrumProblem(
  layout: DataLayout,
  kernel: KernelSampler,
  par: Parameterisation,
  scale: MisfitScale = 'log',
): SpectrumProblem {
  if (kernel.n !== layout.freqs.length) throw new Error('kernel grid does not match the data grid');
  const nS = layout.stations.length;
  const nR = par.regions.length;
  const n = par.slots.length;
  const m = layout.nData;
  const nb = kernel.n;
  if (n > m) throw new InversionInputError(`more free parameters (${n}) than data (${m})`);
  const used = new Uint8Array(nS);
  for (const s of layout.series) used[s.station] = 1;
  const maxNodes = par.regions.map((r) => (r.footprint ? r.footprint.length / SPOT_STRIDE : r.hasSpread ? SPOT_MAX_NODES : 1));
  // A region whose place and shape are fixed has the same effective kernels at every point: sampled once.
  const still = par.regions.map((r) => r.index.lat < 0 && r.index.lon < 0 && r.index.spread < 0);
  let sampledOnce = false;
  // Per station x region x node: kernel samples and geometry; per station x region: effective kernels.
  const buf: KernelBuffers[][] = [];
  const gc: GreatCircle[][] = [];
  const eff: Float64Array[][] = []; // [pair][component]
  const effPlus: Float64Array[][] = [];
  const effMinus: Float64Array[][] = [];
  for (let s = 0; s < nS; s++) {
    for (let r = 0; r < nR; r++) {
      buf.push(Array.from({ length: maxNodes[r] }, () => createKernelBuffers(nb)));
      gc.push(Array.from({ length: maxNodes[r] }, () => ({}) as GreatCircle));
      eff.push([0, 1, 2].map(() => new Float64Array(nb)));
      effPlus.push(par.regions[r].index.spread >= 0 ? [0, 1, 2].map(() => new Float64Array(nb)) : []);
      effMinus.push(par.regions[r].index.spread >= 0 ? [0, 1, 2].map(() => new Float64Array(nb)) : []);
    }
  }
  const nodes = par.regions.map((r) => r.footprint ?? new Float64Array(SPOT_MAX_NODES * SPOT_STRIDE));
  const nodeCount = new Int32Array(nR);
  const inten = new Float64Array(nR);
  const spread = new Float64Array(nR);
  const last = new Float64Array(n).fill(NaN);
  const predicted = new Float64Array(m);
  const spot = createSpotScratch(nb);
  const dLat = new Float64Array(nb);
  const dLon = new Float64Array(nb);
  const dRdP = new Float64Array(Math.max(...layout.series.map((se) => se.bins.length)));
  let rScratch: Float64Array | undefined;
  let cScratch: Float64Array | undefined;

  function sampleAt(p: Float64Array): void {
    for (let r = 0; r < nR; r++) {
      const reg = par.regions[r];
      inten[r] = Math.exp(regionValue(reg, 'intensity', p));
      if (still[r] && sampledOnce) continue;
      spread[r] = reg.hasSpread ? regionValue(reg, 'spread', p) : 0;
      nodeCount[r] = reg.footprint
        ? maxNodes[r]
        : spotNodesInto(regionValue(reg, 'lat', p), regionValue(reg, 'lon', p), spread[r], nodes[r]);
      for (let s = 0; s < nS; s++) {
        if (!used[s]) continue;
        const i = s * nR + r;
        effectiveKernels(kernel, layout.stations[s], nodes[r], nodeCount[r], buf[i], gc[i], eff[i]);
      }
    }
    sampledOnce = true;
    last.set(p);
  }

  function same(p: Float64Array): boolean {
    for (let j = 0; j < n; j++) if (p[j] !== last[j]) return false;
    return true;
  }

  function residuals(p: Float64Array, out: Float64Array): void {
    if (!same(p)) sampleAt(p);
    for (const se of layout.series) {
      const { bins, component, offset } = se;
      const len = bins.length;
      for (let k = 0; k < len; k++) predicted[offset + k] = 0;
      for (let r = 0; r < nR; r++) {
        const E = eff[se.station * nR + r][component];
        const I = inten[r];
        for (let k = 0; k < len; k++) predicted[offset + k] += I * E[bins[k]];
      }
      const inv = se.invSigma;
      if (scale === 'log') for (let k = 0; k < len; k++) out[offset + k] = (Math.log(predicted[offset + k]) - se.lnObs[k]) * inv;
      else if (scale === 'linear') for (let k = 0; k < len; k++) out[offset + k] = (predicted[offset + k] / se.obs[k] - 1) * inv;
      else for (let k = 0; k < len; k++) out[offset + k] = (predicted[offset + k] / se.obs[k]) * inv;
      if (se.whiten) whitenResiduals(se.whiten, out, offset);
    }
  }

  /** Column-major Jacobian: every free parameter belongs to one region, whose loop writes its whole column. */
  function jacobianColumns(p: Float64Array, out: Float64Array): void {
    if (!same(p)) residuals(p, (rScratch ??= new Float64Array(m)));
    for (let r = 0; r < nR; r++) {
      const reg = par.regions[r];
      if (reg.index.spread < 0) continue;
      const lat = regionValue(reg, 'lat', p);
      const lon = regionValue(reg, 'lon', p);
      for (let s = 0; s < nS; s++) {
        const i = s * nR + r;
        if (used[s]) spreadDerivative(kernel, layout.stations[s], lat, lon, spread[r], spot, effPlus[i], effMinus[i]);
      }
    }
    for (const se of layout.series) {
      const { bins, component, offset } = se;
      const len = bins.length;
      // d r / d P per bin: log scale 1/(sigma P); otherwise 1/(sigma P_obs)
      if (scale === 'log') for (let k = 0; k < len; k++) dRdP[k] = se.invSigma / predicted[offset + k];
      else for (let k = 0; k < len; k++) dRdP[k] = se.invSigma / se.obs[k];
      for (let r = 0; r < nR; r++) {
        const { intensity: jI, lat: jLat, lon: jLon, spread: jSp } = par.regions[r].index;
        const i = se.station * nR + r;
        const I = inten[r];
        if (jI >= 0) columnInto(out, jI * m + offset, I, eff[i][component], bins);
        if (jLat >= 0 || jLon >= 0) centreDerivatives(nodes[r], nodeCount[r], gc[i], buf[i], component, dLat, dLon);
        if (jLat >= 0) columnInto(out, jLat * m + offset, I, dLat, bins);
        if (jLon >= 0) columnInto(out, jLon * m + offset, I, dLon, bins);
        if (jSp >= 0) columnInto(out, jSp * m + offset, I, effPlus[i][component], bins);
      }
      if (se.whiten) whitenColumns(se.whiten, out, offset, m, n);
    }
  }

  /** out[at + k] = I dRdP[k] dE[bins[k]]: one series' stretch of one column. */
  function columnInto(out: Float64Array, at: number, I: number, dE: Float64Array, bins: Int32Array): void {
    for (let k = 0; k < bins.length; k++) out[at + k] = I * dRdP[k] * dE[bins[k]];
  }

  function jacobian(p: Float64Array, out: Float64Array): void {
    jacobianColumns(p, (cScratch ??= new Float64Array(m * n)));
    transposeInto(cScratch, n, m, out);
  }

  function refineStart(p: Float64Array): void {
    sampleAt(p);
    linearStartIntensities(layout, par, (s, r, c) => eff[s * nR + r][c], inten, p);
  }

  return {
    nParams: n,
    nResiduals: m,
    nData: m,
    lower: par.lower,
    upper: par.upper,
    residuals,
    jacobian,
    jacobianColumns,
    predicted,
    refineStart,
  };
}
