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
  const free: { r: number; j: number }[] = [];
  par.regions.forEach((reg, r) => {
    if (reg.index.intensity >= 0) {
      freeOf[r] = free.length;
      free.push({ r, j: reg.index.intensity });
    }
  });
  if (free.length === 0) return;
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
      const effs = Array.from({ length: nR }, (_, r) => effective(se.station, r, se.component));
      for (let q = 0; q < se.bins.length; q++) {
        const b = se.bins[q];
        const o = se.obs[q];
        // known part: fixed-intensity regions and intensities held at a bound
        let known = 0;
        for (let r = 0; r < nR; r++) {
          const fi = freeOf[r];
          if (fi < 0) known += intensities[r] * effs[r][b];
          else if (!active[fi]) known += value[fi] * effs[r][b];
        }
        const rhs = (1 - known / o) * w;
        for (let a = 0; a < k; a++) {
          const ea = (effs[free[idx[a]].r][b] / o) * w;
          atb[a] += ea * rhs;
          for (let c = 0; c < k; c++) ata[a * k + c] += ea * (effs[free[idx[c]].r][b] / o) * w;
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
