/**
 * Grouping of finished starts into distinct minima. Converged starts are
 * taken best first; a start joins an existing minimum when every parameter
 * lies within MINIMA_PARAM_TOL of that parameter's range of the minimum's
 * best point (longitudes compared around the circle) and the misfits agree
 * within MINIMA_MISFIT_REL_TOL; otherwise it opens a new minimum. Starts that
 * did not converge join the minimum nearest in the same scaled distance, so
 * the counts add up to the number of starts; one that ended below that
 * minimum's misfit becomes its best point when it lies within the same
 * tolerances, and otherwise opens a minimum of its own. So every minimum's
 * misfit is the smallest final misfit of its starts. Minima come best first.
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

export function scaledDistance(a: ArrayLike<number>, b: ArrayLike<number>, o: GroupingOptions): number {
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

function sameMinimum(f: FinishedStart, best: FinishedStart, o: GroupingOptions): boolean {
  const tol = o.paramTol ?? MINIMA_PARAM_TOL;
  const rel = o.misfitRelTol ?? MINIMA_MISFIT_REL_TOL;
  return (
    scaledDistance(f.params, best.params, o) <= tol &&
    Math.abs(f.chi2 - best.chi2) <= rel * Math.max(f.chi2, best.chi2) + MINIMA_MISFIT_ABS_TOL
  );
}

/** Misfit as a sort key: non-finite values last. */
const key = (f: FinishedStart) => (Number.isFinite(f.chi2) ? f.chi2 : Infinity);

export function groupMinima(finished: FinishedStart[], o: GroupingOptions): Group[] {
  const byMisfit = (a: FinishedStart, b: FinishedStart) => key(a) - key(b) || a.index - b.index;
  const good = finished.filter((f) => f.converged && Number.isFinite(f.chi2)).sort(byMisfit);
  const rest = finished.filter((f) => !(f.converged && Number.isFinite(f.chi2))).sort(byMisfit);
  const groups: Group[] = [];
  for (const f of good) {
    const g = groups.find((g) => sameMinimum(f, g.best, o));
    if (g) g.members.push(f);
    else groups.push({ best: f, members: [f] });
  }
  for (const f of rest) {
    if (groups.length === 0) {
      groups.push({ best: f, members: [f] });
      continue;
    }
    if (!Number.isFinite(f.chi2)) {
      // no place to compare: counted with the worst minimum
      groups.reduce((w, g) => (key(g.best) >= key(w.best) ? g : w)).members.push(f);
      continue;
    }
    let bestG = groups[0];
    let bestD = Infinity;
    for (const g of groups) {
      const d = scaledDistance(f.params, g.best.params, o);
      if (d < bestD) [bestD, bestG] = [d, g];
    }
    if (!(f.chi2 < bestG.best.chi2)) bestG.members.push(f);
    else if (sameMinimum(f, bestG.best, o)) {
      bestG.members.push(f);
      bestG.best = f;
    } else groups.push({ best: f, members: [f] });
  }
  for (const g of groups) g.members.sort((a, b) => a.index - b.index);
  return groups.sort((a, b) => byMisfit(a.best, b.best));
}
