/**
 * Clustering multi-start: stopping starts recognised early as falling into an
 * already-found basin, in the spirit of the clustering methods of Rinnooy Kan
 * & Timmer (1987, Math. Programming 39, 27-56, pages from memory). Starts run
 * in waves of CLUSTER_WAVE in start order; the minima found by earlier waves
 * (the best converged start of each group, grouped as in grouping.ts) are the
 * known basins of a wave. A start whose iterate, after CLUSTER_MIN_ITERATIONS
 * iterations, lies within CLUSTER_JOIN_DIST of a known minimum (the largest
 * parameter difference as a fraction of the parameter's range) is stopped
 * there and counted in that minimum: a descent that close to a minimum ends
 * in it. The known minima of a wave depend only on earlier waves, so which
 * starts stop is the same for any thread count.
 */
import { CLUSTER_JOIN_DIST, CLUSTER_MIN_ITERATIONS } from '@/src/engine/tolerances';
import { groupMinima, scaledDistance, type GroupingOptions } from './grouping';
import type { StartOutcome } from './descents';

/** A minimum found by an earlier wave: the start that reached it and its point. */
export interface KnownMinimum {
  index: number;
  params: number[];
}

/** The known minima after some waves: the best converged start of each group of searched starts. */
export function knownMinima(outcomes: StartOutcome[], bounds: GroupingOptions): KnownMinimum[] {
  const searched = outcomes.filter((o) => o.joins === undefined);
  return groupMinima(searched, bounds)
    .filter((g) => g.best.converged && Number.isFinite(g.best.chi2))
    .map((g) => ({ index: g.best.index, params: Array.from(g.best.params) }));
}

/** The known minimum an iterate has come close enough to join, or -1 (its start index otherwise). */
export function basinOf(p: Float64Array, iterations: number, known: KnownMinimum[], bounds: GroupingOptions): number {
  if (iterations < CLUSTER_MIN_ITERATIONS) return -1;
  for (const m of known) {
    if (scaledDistance(p, m.params, bounds) <= CLUSTER_JOIN_DIST) return m.index;
  }
  return -1;
}
