/**
 * The spectrum misfit as a least-squares problem: residual per kept bin
 * r = (ln P_pred - ln P_obs) / sigmaLog (or, in the 'linear' variant,
 * (P_pred / P_obs - 1) / sigmaLog, used to check against linear least squares).
 *
 * P_pred = sum_r I_r K_c(theta_r)[f] proj_c(bearing_r) with K_Ez = ez,
 * K_Bns = bh sin^2(bearing), K_Bew = bh cos^2(bearing). Analytic Jacobian by the
 * chain rule: d/d(ln I) = I K proj; d/d(lat) = I (dK/dtheta dtheta/dlat proj +
 * K dproj/dbearing dbearing/dlat), the same for lon; dproj/dbearing is
 * sin(2b) for Bns and -sin(2b) for Bew. Kernel samples from the last
 * residual evaluation are reused when the Jacobian is asked at the same point.
 */
import { greatCircleInto, type GreatCircle } from '@/src/engine/geometry/great-circle';
import type { LeastSquaresProblem } from '@/src/engine/optim/types';
import type { DataLayout } from './data-layout';
import { createKernelBuffers, type KernelBuffers, type KernelSampler } from './kernel-sampler';
import { regionValue, type Parameterisation } from './parameters';
import { InversionInputError } from './errors';

/** 'log': ln-power misfit; 'linear': relative power misfit; 'power': r = P / (sigma P_obs), the bare model (for derived objectives). */
export type MisfitScale = 'log' | 'linear' | 'power';

export interface SpectrumProblem extends LeastSquaresProblem {
  nData: number;
  /** Predicted power per residual at the last evaluated point. */
  predicted: Float64Array;
}

export function spectrumProblem(
  layout: DataLayout,
  kernel: KernelSampler,
  par: Parameterisation,
  scale: MisfitScale = 'log',
): SpectrumProblem {
  if (par.regions.some((r) => r.hasSpread)) {
    throw new InversionInputError('region spread is not supported by the spectrum objective yet; give point regions');
  }
  if (kernel.n !== layout.freqs.length) throw new Error('kernel grid does not match the data grid');
  const nS = layout.stations.length;
  const nR = par.regions.length;
  const n = par.slots.length;
  const m = layout.nData;
  if (n > m) throw new InversionInputError(`more free parameters (${n}) than data (${m})`);
  // Per station x region: kernel samples and geometry.
  const used = new Uint8Array(nS);
  for (const s of layout.series) used[s.station] = 1;
  const buf: KernelBuffers[] = Array.from({ length: nS * nR }, () => createKernelBuffers(kernel.n));
  const gc: GreatCircle[] = Array.from({ length: nS * nR }, () => ({}) as GreatCircle);
  const inten = new Float64Array(nR);
  const last = new Float64Array(n).fill(NaN);
  const predicted = new Float64Array(m);

  function sampleAt(p: Float64Array): void {
    for (let r = 0; r < nR; r++) {
      const reg = par.regions[r];
      inten[r] = Math.exp(regionValue(reg, 'intensity', p));
      const lat = regionValue(reg, 'lat', p);
      const lon = regionValue(reg, 'lon', p);
      for (let s = 0; s < nS; s++) {
        if (!used[s]) continue;
        const st = layout.stations[s];
        const g = gc[s * nR + r];
        greatCircleInto(st.lat, st.lon, lat, lon, g);
        kernel.sample(g.theta, buf[s * nR + r]);
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
      const nb = bins.length;
      for (let k = 0; k < nb; k++) predicted[offset + k] = 0;
      for (let r = 0; r < nR; r++) {
        const i = se.station * nR + r;
        const kb = buf[i];
        const bearing = gc[i].bearing;
        const coef = inten[r] * (component === 0 ? 1 : component === 1 ? Math.sin(bearing) ** 2 : Math.cos(bearing) ** 2);
        const K = component === 0 ? kb.ez : kb.bh;
        for (let k = 0; k < nb; k++) predicted[offset + k] += coef * K[bins[k]];
      }
      const inv = se.invSigma;
      if (scale === 'log') for (let k = 0; k < nb; k++) out[offset + k] = (Math.log(predicted[offset + k]) - se.lnObs[k]) * inv;
      else if (scale === 'linear') for (let k = 0; k < nb; k++) out[offset + k] = (predicted[offset + k] / se.obs[k] - 1) * inv;
      else for (let k = 0; k < nb; k++) out[offset + k] = (predicted[offset + k] / se.obs[k]) * inv;
    }
  }

  function jacobian(p: Float64Array, out: Float64Array): void {
    if (!same(p)) residuals(p, new Float64Array(m));
    out.fill(0);
    for (const se of layout.series) {
      const { bins, component, offset } = se;
      for (let r = 0; r < nR; r++) {
        const reg = par.regions[r];
        const i = se.station * nR + r;
        const kb = buf[i];
        const g = gc[i];
        const sb = Math.sin(g.bearing);
        const cb = Math.cos(g.bearing);
        const proj = component === 0 ? 1 : component === 1 ? sb * sb : cb * cb;
        const dProj = component === 0 ? 0 : component === 1 ? 2 * sb * cb : -2 * sb * cb;
        const K = component === 0 ? kb.ez : kb.bh;
        const dK = component === 0 ? kb.dEz : kb.dBh;
        const jI = reg.index.intensity;
        const jLat = reg.index.lat;
        const jLon = reg.index.lon;
        const I = inten[r];
        for (let k = 0; k < bins.length; k++) {
          const b = bins[k];
          const row = (offset + k) * n;
          // d r / d P: log scale 1/(sigma P); linear scale 1/(sigma P_obs)
          const w = (I * se.invSigma) / (scale === 'log' ? predicted[offset + k] : se.obs[k]);
          if (jI >= 0) out[row + jI] += w * K[b] * proj;
          if (jLat >= 0) out[row + jLat] += w * (dK[b] * g.dThetaDLat * proj + K[b] * dProj * g.dBearingDLat);
          if (jLon >= 0) out[row + jLon] += w * (dK[b] * g.dThetaDLon * proj + K[b] * dProj * g.dBearingDLon);
        }
      }
    }
  }

  return { nParams: n, nResiduals: m, nData: m, lower: par.lower, upper: par.upper, residuals, jacobian, predicted };
}
