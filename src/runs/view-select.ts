/**
 * Which parts of a run's view the page shows first, shared by the server (first view, figures
 * drawn there) and the browser (the same choice after hydration). Pure: no database, no React.
 */
import type { IntervalView } from './results';
import type { Region } from './grid-spec';

/** Intervals with at least one minimum, in time order. */
export function solvedIntervals(intervals: IntervalView[]): IntervalView[] {
  return intervals.filter((i) => i.result && i.result.minima.length);
}

/** The interval the run page opens on: the last one solved. */
export function openingInterval(intervals: IntervalView[]): IntervalView | null {
  return solvedIntervals(intervals).at(-1) ?? null;
}

/** Each region's colour by its name, as the figures key them. */
export function regionColours(regions: Region[]): Record<string, string> {
  return Object.fromEntries(regions.map((r) => [r.name, r.colour]));
}
