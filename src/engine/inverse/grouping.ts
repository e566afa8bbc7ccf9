/**
 * Grouping of finished starts into distinct minima. Converged starts are
 * taken best first; a start joins an existing minimum when every parameter
 * lies within MINIMA_PARAM_TOL of that parameter's range of the minimum's
 * best point (longitudes compared around the circle) and the misfits agree
 * within MINIMA_MISFIT_REL_TOL; otherwise it opens a new minimum. Starts that
 * did not converge join the minimum nearest in the same scaled distance, so
 * the counts add up to the number of starts.
 */
import { MINIMA_MISFIT_ABS_TOL, MINIMA_MISFIT_REL_TOL, MINIMA_PARAM_TOL, MINIMA_UNBOUNDED_SCALE } from '@/src/engine/tolerances';

export interface FinishedStart {
  index: number;
  params: Float64Array;
  chi2: number;
  converged: boolean;
}

export interface GroupingOptions {
  lower: Float64Array;
  upper: Float64Array;
  /** Parameters that are angles on a circle (longitudes). */
  periodic?: Uint8Array;
  paramTol?: number;
  misfitRelTol?: number;
}

export interface Group {
  best: FinishedStart;
  members: FinishedStart[];
}

export function scaledDistance(a: Float64Array, b: Float64Array, o: GroupingOptions): number {
  let worst = 0;
  for (let j = 0; j < a.length; j++) {
    let d = Math.abs(a[j] - b[j]);
    if (o.periodic?.[j]) d = Math.min(d % 360, 360 - (d % 360));
    const range = o.upper[j] - o.lower[j];
    const scale = Number.isFinite(range) && range > 0 ? range : MINIMA_UNBOUNDED_SCALE;
    worst = Math.max(worst, d / scale);
  }
  return worst;
}

export function groupMinima(finished: FinishedStart[], o: GroupingOptions): Group[] {
  const tol = o.paramTol ?? MINIMA_PARAM_TOL;
  const rel = o.misfitRelTol ?? MINIMA_MISFIT_REL_TOL;
  const byMisfit = (a: FinishedStart, b: FinishedStart) => a.chi2 - b.chi2 || a.index - b.index;
  const good = finished.filter((f) => f.converged && Number.isFinite(f.chi2)).sort(byMisfit);
  const rest = finished.filter((f) => !(f.converged && Number.isFinite(f.chi2))).sort(byMisfit);
  const groups: Group[] = [];
  for (const f of good) {
    const g = groups.find(
      (g) =>
        scaledDistance(f.params, g.best.params, o) <= tol &&
        Math.abs(f.chi2 - g.best.chi2) <= rel * Math.max(f.chi2, g.best.chi2) + MINIMA_MISFIT_ABS_TOL,
    );
    if (g) g.members.push(f);
    else groups.push({ best: f, members: [f] });
  }
  for (const f of rest) {
    if (groups.length === 0 || !Number.isFinite(f.chi2)) {
      if (groups.length > 0) groups[groups.length - 1].members.push(f);
      else groups.push({ best: f, members: [f] });
      continue;
    }
    let bestG = groups[0];
    let bestD = Infinity;
    for (const g of groups) {
      const d = scaledDistance(f.params, g.best.params, o);
      if (d < bestD) [bestD, bestG] = [d, g];
    }
    bestG.members.push(f);
  }
  for (const g of groups) g.members.sort((a, b) => a.index - b.index);
  return groups;
}
