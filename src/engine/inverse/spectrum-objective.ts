/**
 * The spectrum misfit as a least-squares problem: residual per kept bin
 * r = (ln P_pred - ln P_obs) / sigmaLog ('log'; or (P_pred / P_obs - 1) / sigmaLog,
 * 'linear', used to check against linear least squares; or the bare model
 * P_pred / (sigma P_obs), 'power', for derived objectives).
 *
 * P_pred = sum_r I_r E_c,r with the effective kernel of region r
 * E_c,r = sum_q w_q K_c(theta_q) proj_c(bearing_q) over its nodes q (one node
 * for a point region; the engine's 7-node spot quadrature, moving rigidly with
 * the centre, for a region with a spread). K_Ez = ez, K_Bns = bh sin^2(bearing),
 * K_Bew = bh cos^2(bearing). Analytic Jacobian by the chain rule:
 * d/d(ln I) = I E; d/d(centre lat) = I sum_q w_q (dK/dtheta dtheta/dlat proj
 * + K dproj/dbearing dbearing/dlat), with the node's own dependence on the
 * centre (spotNodesInto's derivatives); the same for lon; dproj/dbearing is
 * sin(2b) for Bns and -sin(2b) for Bew. The spread derivative is a central
 * difference of the effective kernel (SPREAD_DIFF_STEP_DEG).
 */
import { greatCircleInto, type GreatCircle } from '@/src/engine/geometry/great-circle';
import { choleskyFactor, choleskySolve } from '@/src/engine/optim/cholesky';
import type { LeastSquaresProblem } from '@/src/engine/optim/types';
import { SPOT_MAX_NODES, SPOT_STRIDE, spotNodesInto } from '@/src/engine/sources/spot';
import { SPREAD_DIFF_STEP_DEG } from '@/src/engine/tolerances';
import type { DataLayout } from './data-layout';
import { InversionInputError } from './errors';
import { createKernelBuffers, type KernelBuffers, type KernelSampler } from './kernel-sampler';
import { regionValue, type Parameterisation } from './parameters';

/** 'log': ln-power misfit; 'linear': relative power misfit; 'power': r = P / (sigma P_obs), the bare model (for derived objectives). */
export type MisfitScale = 'log' | 'linear' | 'power';

export interface SpectrumProblem extends LeastSquaresProblem {
  nData: number;
  /** Predicted power per residual at the last evaluated point. */
  predicted: Float64Array;
  /**
   * Replace the free intensities of a start point by the bounded linear least-squares
   * fit of the relative power misfit for its centres (P is linear in the intensities),
   * so that LM starts with the right intensity scale.
   */
  refineStart(p: Float64Array): void;
}

export function spectrumProblem(layout: DataLayout, kernel: KernelSampler, par: Parameterisation, scale: MisfitScale = 'log'): SpectrumProblem {
  if (kernel.n !== layout.freqs.length) throw new Error('kernel grid does not match the data grid');
  const nS = layout.stations.length;
  const nR = par.regions.length;
  const n = par.slots.length;
  const m = layout.nData;
  const nb = kernel.n;
  if (n > m) throw new InversionInputError(`more free parameters (${n}) than data (${m})`);
  const used = new Uint8Array(nS);
  for (const s of layout.series) used[s.station] = 1;
  const maxNodes = par.regions.map((r) => (r.hasSpread ? SPOT_MAX_NODES : 1));
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
  const nodes = Array.from({ length: nR }, () => new Float64Array(SPOT_MAX_NODES * SPOT_STRIDE));
  const nodeCount = new Int32Array(nR);
  const inten = new Float64Array(nR);
  const spread = new Float64Array(nR);
  const last = new Float64Array(n).fill(NaN);
  const predicted = new Float64Array(m);
  const scratchNodes = new Float64Array(SPOT_MAX_NODES * SPOT_STRIDE);
  const scratchBuf = createKernelBuffers(nb);
  const scratchGc = {} as GreatCircle;
  const dLat = new Float64Array(nb);
  const dLon = new Float64Array(nb);

  /** Effective kernels of one station and a set of nodes into out[component]; samples into bufs/gcs. */
  function effective(st: { lat: number; lon: number }, nodeArr: Float64Array, count: number, bufs: KernelBuffers[] | null, gcs: GreatCircle[] | null, out: Float64Array[]) {
    out[0].fill(0);
    out[1].fill(0);
    out[2].fill(0);
    for (let q = 0; q < count; q++) {
      const o = q * SPOT_STRIDE;
      const g = gcs ? gcs[q] : scratchGc;
      const kb = bufs ? bufs[q] : scratchBuf;
      greatCircleInto(st.lat, st.lon, nodeArr[o], nodeArr[o + 1], g);
      kernel.sample(g.theta, kb);
      const w = nodeArr[o + 2];
      const sn = w * Math.sin(g.bearing) ** 2;
      const cs = w * Math.cos(g.bearing) ** 2;
      for (let k = 0; k < nb; k++) {
        out[0][k] += w * kb.ez[k];
        out[1][k] += sn * kb.bh[k];
        out[2][k] += cs * kb.bh[k];
      }
    }
  }

  function sampleAt(p: Float64Array): void {
    for (let r = 0; r < nR; r++) {
      const reg = par.regions[r];
      inten[r] = Math.exp(regionValue(reg, 'intensity', p));
      spread[r] = reg.hasSpread ? regionValue(reg, 'spread', p) : 0;
      nodeCount[r] = spotNodesInto(regionValue(reg, 'lat', p), regionValue(reg, 'lon', p), spread[r], nodes[r]);
      for (let s = 0; s < nS; s++) {
        if (!used[s]) continue;
        const i = s * nR + r;
        effective(layout.stations[s], nodes[r], nodeCount[r], buf[i], gc[i], eff[i]);
      }
    }
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
    }
  }

  /** d(effective kernel of one component)/d(centre lat, lon) into dLat, dLon. */
  function centreDerivatives(i: number, r: number, component: number): void {
    dLat.fill(0);
    dLon.fill(0);
    const nd = nodes[r];
    for (let q = 0; q < nodeCount[r]; q++) {
      const o = q * SPOT_STRIDE;
      const w = nd[o + 2];
      const g = gc[i][q];
      const kb = buf[i][q];
      const tLat = g.dThetaDLat * nd[o + 3] + g.dThetaDLon * nd[o + 5];
      const tLon = g.dThetaDLat * nd[o + 4] + g.dThetaDLon * nd[o + 6];
      const bLat = g.dBearingDLat * nd[o + 3] + g.dBearingDLon * nd[o + 5];
      const bLon = g.dBearingDLat * nd[o + 4] + g.dBearingDLon * nd[o + 6];
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

  function jacobian(p: Float64Array, out: Float64Array): void {
    if (!same(p)) residuals(p, new Float64Array(m));
    out.fill(0);
    // spread: central differences of the effective kernels, once per station x region
    for (let r = 0; r < nR; r++) {
      if (par.regions[r].index.spread < 0) continue;
      const reg = par.regions[r];
      const lat = regionValue(reg, 'lat', p);
      const lon = regionValue(reg, 'lon', p);
      const h = SPREAD_DIFF_STEP_DEG;
      const lo = Math.max(0, spread[r] - h);
      const hi = spread[r] + h;
      for (let s = 0; s < nS; s++) {
        if (!used[s]) continue;
        const i = s * nR + r;
        effective(layout.stations[s], scratchNodes, spotNodesInto(lat, lon, hi, scratchNodes), null, null, effPlus[i]);
        effective(layout.stations[s], scratchNodes, spotNodesInto(lat, lon, lo, scratchNodes), null, null, effMinus[i]);
        for (let c = 0; c < 3; c++) for (let k = 0; k < nb; k++) effPlus[i][c][k] = (effPlus[i][c][k] - effMinus[i][c][k]) / (hi - lo);
      }
    }
    for (const se of layout.series) {
      const { bins, component, offset } = se;
      for (let r = 0; r < nR; r++) {
        const reg = par.regions[r];
        const i = se.station * nR + r;
        const jI = reg.index.intensity;
        const jLat = reg.index.lat;
        const jLon = reg.index.lon;
        const jSp = reg.index.spread;
        if (jLat >= 0 || jLon >= 0) centreDerivatives(i, r, component);
        const E = eff[i][component];
        const dSp = jSp >= 0 ? effPlus[i][component] : null;
        const I = inten[r];
        for (let k = 0; k < bins.length; k++) {
          const b = bins[k];
          const row = (offset + k) * n;
          // d r / d P: log scale 1/(sigma P); otherwise 1/(sigma P_obs)
          const w = (I * se.invSigma) / (scale === 'log' ? predicted[offset + k] : se.obs[k]);
          if (jI >= 0) out[row + jI] += w * E[b];
          if (jLat >= 0) out[row + jLat] += w * dLat[b];
          if (jLon >= 0) out[row + jLon] += w * dLon[b];
          if (dSp) out[row + jSp] += w * dSp[b];
        }
      }
    }
  }

  function refineStart(p: Float64Array): void {
    const free = par.regions.map((r, i) => ({ r: i, j: r.index.intensity })).filter((x) => x.j >= 0);
    if (free.length === 0) return;
    sampleAt(p);
    const active = free.map(() => true);
    const value = free.map(({ j }) => Math.exp(Math.min(par.upper[j], Math.max(par.lower[j], p[j]))));
    for (let pass = 0; pass <= free.length; pass++) {
      const idx = free.map((_, a) => a).filter((a) => active[a]);
      if (idx.length === 0) break;
      const k = idx.length;
      const ata = new Float64Array(k * k);
      const atb = new Float64Array(k);
      for (const se of layout.series) {
        const w = se.invSigma;
        for (let q = 0; q < se.bins.length; q++) {
          const b = se.bins[q];
          const o = se.obs[q];
          // known part: fixed-intensity regions and intensities held at a bound
          let known = 0;
          for (let r = 0; r < nR; r++) {
            const fi = free.findIndex((f) => f.r === r);
            if (fi < 0) known += inten[r] * eff[se.station * nR + r][se.component][b];
            else if (!active[fi]) known += value[fi] * eff[se.station * nR + r][se.component][b];
          }
          const rhs = (1 - known / o) * w;
          for (let a = 0; a < k; a++) {
            const ea = (eff[se.station * nR + free[idx[a]].r][se.component][b] / o) * w;
            atb[a] += ea * rhs;
            for (let c = 0; c < k; c++) ata[a * k + c] += ea * (eff[se.station * nR + free[idx[c]].r][se.component][b] / o) * w;
          }
        }
      }
      if (!choleskyFactor(ata, k)) return;
      choleskySolve(ata, k, atb);
      let clamped = false;
      idx.forEach((a, c) => {
        const { j } = free[a];
        const lo = Math.exp(par.lower[j]);
        if (!(atb[c] > lo)) {
          value[a] = lo;
          active[a] = false;
          clamped = true;
        } else value[a] = Math.min(Math.exp(par.upper[j]), atb[c]);
      });
      if (!clamped) break;
    }
    free.forEach(({ j }, a) => (p[j] = Math.log(value[a])));
  }

  return { nParams: n, nResiduals: m, nData: m, lower: par.lower, upper: par.upper, residuals, jacobian, predicted, refineStart };
}
