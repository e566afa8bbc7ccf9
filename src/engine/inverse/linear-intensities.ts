/**
 * Intensities for a start point: with the centres (and spreads) of a start
 * fixed, the predicted power is linear in the intensities, so the relative
 * power misfit sum ((sum_r I_r E_r / P_obs - 1) / sigma)^2 is an ordinary
 * linear least-squares problem. Solved by the normal equations (Cholesky);
 * an intensity that falls below its lower bound is held there and the rest
 * re-solved (the active-set idea of Lawson & Hanson 1974, ch. 23). Written
 * into p as ln I.
 */
import { choleskyFactor, choleskySolve } from '@/src/engine/optim/cholesky';
import type { DataLayout } from './data-layout';
import type { Parameterisation } from './parameters';

export function linearStartIntensities(
  layout: DataLayout,
  par: Parameterisation,
  /** Effective kernel of station s, region r, component c (per grid bin). */
  effective: (s: number, r: number, c: number) => Float64Array,
  /** Current intensities of all regions (fixed ones are used as they are). */
  intensities: Float64Array,
  p: Float64Array,
): void {
  const nR = par.regions.length;
  const freeOf = new Int32Array(nR).fill(-1);
  const freeR: number[] = [];
  const freeJ: number[] = [];
  par.regions.forEach((reg, r) => {
    if (reg.index.intensity >= 0) {
      freeOf[r] = freeR.length;
      freeR.push(r);
      freeJ.push(reg.index.intensity);
    }
  });
  const nF = freeR.length;
  if (nF === 0) return;
  const active = new Uint8Array(nF).fill(1);
  const value = Float64Array.from(freeJ, (j) => Math.exp(Math.min(par.upper[j], Math.max(par.lower[j], p[j]))));
  const idx = new Int32Array(nF); // region of each active free intensity
  const ata = new Float64Array(nF * nF);
  const atb = new Float64Array(nF);
  const e = new Float64Array(nF); // one bin's row of the design matrix
  const effs: Float64Array[] = new Array<Float64Array>(nR);
  for (let pass = 0; pass <= nF; pass++) {
    let k = 0;
    for (let a = 0; a < nF; a++) if (active[a]) idx[k++] = freeR[a];
    if (k === 0) break;
    ata.fill(0);
    atb.fill(0);
    for (const se of layout.series) {
      const { bins, obs, invSigma: w } = se;
      for (let r = 0; r < nR; r++) effs[r] = effective(se.station, r, se.component);
      for (let q = 0; q < bins.length; q++) {
        const b = bins[q];
        const o = obs[q];
        // known part: fixed-intensity regions and intensities held at a bound
        let known = 0;
        for (let r = 0; r < nR; r++) {
          const fi = freeOf[r];
          if (fi < 0) known += intensities[r] * effs[r][b];
          else if (!active[fi]) known += value[fi] * effs[r][b];
        }
        const rhs = (1 - known / o) * w;
        for (let a = 0; a < k; a++) e[a] = (effs[idx[a]][b] / o) * w;
        for (let a = 0; a < k; a++) {
          const ea = e[a];
          atb[a] += ea * rhs;
          for (let c = 0; c < k; c++) ata[a * k + c] += ea * e[c];
        }
      }
    }
    if (!choleskyFactor(ata, k)) return;
    choleskySolve(ata, k, atb);
    let clamped = false;
    for (let a = 0, c = 0; a < nF; a++) {
      if (!active[a]) continue;
      const lo = Math.exp(par.lower[freeJ[a]]);
      const x = atb[c++];
      if (!(x > lo)) {
        value[a] = lo;
        active[a] = 0;
        clamped = true;
      } else value[a] = Math.min(Math.exp(par.upper[freeJ[a]]), x);
    }
    if (!clamped) break;
  }
  for (let a = 0; a < nF; a++) p[freeJ[a]] = Math.log(value[a]);
}
