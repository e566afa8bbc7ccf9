/**
 * From grouped start outcomes to reported minima: misfit, reduced chi-square,
 * counts, physical parameters, standard errors from (J^T W J)^-1 (optionally
 * times the reduced chi-square), correlation and resolution matrices, and
 * the singular flag.
 */
import { covarianceFromJtJ } from '@/src/engine/optim/covariance';
import { groupMinima } from './grouping';
import { namedStdErrors } from './named-errors';
import { physicalParams, sourcesOf, type Parameterisation } from './parameters';
import type { StartOutcome } from './descents';
import type { Minimum, StartEnds, StartStop } from './types';

function square(a: Float64Array, n: number): number[][] {
  return Array.from({ length: n }, (_, i) => Array.from(a.subarray(i * n, i * n + n)));
}

export function buildMinima(outcomes: StartOutcome[], par: Parameterisation, nData: number, scaleErrors: boolean): Minimum[] {
  const n = par.slots.length;
  const periodic = Uint8Array.from(par.slots, (s) => (s.kind === 'lon' ? 1 : 0));
  const byIndex = new Map(outcomes.map((o) => [o.index, o]));
  const groups = groupMinima(
    outcomes.filter((o) => o.joins === undefined),
    { lower: par.lower, upper: par.upper, periodic },
  );
  // a start stopped before its search is counted in the minimum of the start it is linked to (clustering.ts)
  const groupOf = new Map<number, (typeof groups)[number]>();
  for (const g of groups) for (const m of g.members) groupOf.set(m.index, g);
  for (const o of outcomes) {
    if (o.joins === undefined) continue;
    const g = groupOf.get(o.joins) ?? groups[groups.length - 1];
    g.members.push(o);
    g.members.sort((a, b) => a.index - b.index);
  }
  const dof = Math.max(1, nData - n);
  return groups.map((g) => {
    const best = byIndex.get(g.best.index)!;
    const reducedChi2 = best.chi2 / dof;
    const cov = covarianceFromJtJ(best.jtj, n, { scale: scaleErrors ? reducedChi2 : 1 });
    const physical = physicalParams(par, best.params);
    const stdErrors = namedStdErrors(par, physical, cov.stdErrors);
    const stopReasons: Partial<Record<StartStop, number>> = {};
    for (const m of g.members) {
      const r = byIndex.get(m.index)!.stopReason;
      stopReasons[r] = (stopReasons[r] ?? 0) + 1;
    }
    return {
      misfit: best.chi2,
      reducedChi2,
      count: g.members.length,
      startIndexes: g.members.map((m) => m.index),
      sources: sourcesOf(par, best.params),
      params: physical,
      internal: Array.from(best.params),
      stdErrors,
      correlation: { names: par.names, matrix: square(cov.correlation, n) },
      resolution: { names: par.names, matrix: square(cov.resolution, n) },
      singular: cov.singular,
      rank: cov.rank,
      stopReasons,
    };
  });
}

/** Each start's own final misfit, iterations, stop reason and minimum rank, in start order. */
export function startEnds(outcomes: StartOutcome[], minima: Minimum[]): StartEnds {
  const rank = new Map<number, number>();
  minima.forEach((m, i) => m.startIndexes.forEach((s) => rank.set(s, i)));
  const sorted = [...outcomes].sort((a, b) => a.index - b.index);
  return {
    index: sorted.map((o) => o.index),
    misfit: sorted.map((o) => (Number.isFinite(o.chi2) ? o.chi2 : null)),
    iterations: sorted.map((o) => o.iterations),
    stopReason: sorted.map((o) => o.stopReason),
    minimum: sorted.map((o) => rank.get(o.index) ?? -1),
  };
}
