/**
 * Goodness of fit of a run in the open: chi-square, its degrees of freedom and
 * how probable a value at least that large is if the stated errors are right
 * (the upper tail of the chi-square distribution, src/engine/stats/chi-square.ts),
 * per interval (its best minimum), per station and component (from the
 * residuals of each series at that minimum, recorded by the solver) and for the
 * whole run (sums over the intervals, the intervals being independent data).
 *
 * Degrees of freedom: an interval has nData - nParams. A station/component
 * carries its share of the fitted parameters, n - nParams n / nData, so that the
 * shares add up to the interval's (common practice for splitting a fit's
 * degrees of freedom over data groups; the parameters are fitted to all of them).
 *
 * Optional error scaling ("scale errors by the misfit"): standard errors times
 * sqrt(chi2 / dof) of their own minimum where that ratio is above 1, never
 * shrunk below the stated ones (the Birge ratio; the Particle Data Group's
 * scale factor S, which it applies only when S > 1: Review of Particle
 * Physics, introduction — common practice, from memory).
 *
 * Pure: used by the server (run view, exports) and the browser (tables, figures).
 */
import { chiSquareTail } from '@/src/engine/stats/chi-square';

/**
 * A fit is marked implausible when a chi-square at least as large as the one found has a probability
 * below this (one in a thousand) under the stated errors: then the errors or the model are wrong for
 * that interval or series, and its stated uncertainties should not be believed as they are.
 */
export const IMPLAUSIBLE_FIT_P = 1e-3;

export interface Goodness {
  chi2: number;
  dof: number;
  /** P(chi-square(dof) >= chi2); NaN when dof is not positive. */
  p: number;
  /** p below IMPLAUSIBLE_FIT_P. */
  implausible: boolean;
}

export function goodnessOf(chi2: number, dof: number): Goodness {
  const p = chiSquareTail(chi2, dof);
  return { chi2, dof, p, implausible: p < IMPLAUSIBLE_FIT_P };
}

/** The misfit of one observed series at the best minimum, as the solver records it. */
export interface SeriesMisfit {
  station: string;
  component: 'Ez' | 'Bns' | 'Bew';
  /** Sum of the squared (whitened) weighted residuals of this series. */
  chi2: number;
  /** Its number of data (bins, or three per observed mode). */
  n: number;
}

/** What the goodness tables need of a stored interval result. */
export interface GoodnessSource {
  startsAt: string;
  nData: number;
  result: {
    nParams: number;
    minima: { misfit: number }[];
    seriesMisfits?: SeriesMisfit[];
  } | null;
}

export interface IntervalGoodness extends Goodness {
  startsAt: string;
}

export interface SeriesGoodness extends Goodness {
  station: string;
  component: 'Ez' | 'Bns' | 'Bew';
  /** Intervals that contributed. */
  intervals: number;
}

export interface RunGoodness {
  /** IMPLAUSIBLE_FIT_P, sent along so that every reader marks by the same rule. */
  threshold: number;
  /** All solved intervals together; null when none is solved. */
  run: Goodness | null;
  intervals: IntervalGoodness[];
  /** Per station and component over the run; only intervals whose series misfits were recorded count. */
  series: SeriesGoodness[];
  /** Solved intervals without recorded series misfits (solved before they were recorded). */
  seriesMissing: number;
}

/** Goodness of the best minimum of one interval; null when it has none. */
export function intervalGoodness(iv: GoodnessSource): IntervalGoodness | null {
  const best = iv.result?.minima[0];
  if (!iv.result || !best || !Number.isFinite(best.misfit)) return null;
  return { startsAt: iv.startsAt, ...goodnessOf(best.misfit, iv.nData - iv.result.nParams) };
}

/** Each series' share of the interval's degrees of freedom: n - nParams n / N. */
export function seriesShares(misfits: readonly SeriesMisfit[], nParams: number): (SeriesMisfit & { dof: number })[] {
  const total = misfits.reduce((a, s) => a + s.n, 0);
  return misfits.map((s) => ({ ...s, dof: total > 0 ? s.n - (nParams * s.n) / total : 0 }));
}

/** Goodness per station and component of one minimum, from its series misfits. */
export function seriesGoodness(misfits: readonly SeriesMisfit[], nParams: number): SeriesGoodness[] {
  return seriesShares(misfits, nParams).map((s) => ({
    station: s.station,
    component: s.component,
    intervals: 1,
    ...goodnessOf(s.chi2, s.dof),
  }));
}

/** Goodness per station and component of one interval's best minimum (empty when not recorded). */
export function intervalSeriesGoodness(iv: GoodnessSource): SeriesGoodness[] {
  const m = iv.result?.seriesMisfits;
  if (!iv.result || !m) return [];
  return seriesGoodness(m, iv.result.nParams);
}

export function runGoodness(intervals: readonly GoodnessSource[]): RunGoodness {
  const each: IntervalGoodness[] = [];
  const sums = new Map<string, { station: string; component: SeriesMisfit['component']; chi2: number; dof: number; k: number }>();
  let missing = 0;
  for (const iv of intervals) {
    const g = intervalGoodness(iv);
    if (!g) continue;
    each.push(g);
    if (!iv.result!.seriesMisfits) {
      missing++;
      continue;
    }
    for (const s of seriesShares(iv.result!.seriesMisfits, iv.result!.nParams)) {
      const key = `${s.station} ${s.component}`;
      const acc = sums.get(key) ?? { station: s.station, component: s.component, chi2: 0, dof: 0, k: 0 };
      acc.chi2 += s.chi2;
      acc.dof += s.dof;
      acc.k++;
      sums.set(key, acc);
    }
  }
  const chi2 = each.reduce((a, g) => a + g.chi2, 0);
  const dof = each.reduce((a, g) => a + g.dof, 0);
  return {
    threshold: IMPLAUSIBLE_FIT_P,
    run: each.length ? goodnessOf(chi2, dof) : null,
    intervals: each,
    series: [...sums.values()]
      .sort((a, b) => a.station.localeCompare(b.station) || a.component.localeCompare(b.component))
      .map((s) => ({ station: s.station, component: s.component, intervals: s.k, ...goodnessOf(s.chi2, s.dof) })),
    seriesMissing: missing,
  };
}

/** Errors times this for a minimum of the given reduced chi-square: sqrt(chi2 / dof) when scaling and above 1, else 1. */
export function misfitErrorScale(reducedChi2: number, scaleByMisfit: boolean): number {
  return scaleByMisfit && Number.isFinite(reducedChi2) && reducedChi2 > 1 ? Math.sqrt(reducedChi2) : 1;
}
