/** The minima a comment may be about: each solved interval with how many minima it has. Pure. */
import type { IntervalView } from '@/src/runs/results';
import { solvedIntervals } from '@/src/runs/view-select';

export function commentTargets(intervals: IntervalView[]): { startsAt: string; minima: number }[] {
  return solvedIntervals(intervals).map((iv) => ({
    startsAt: iv.startsAt,
    minima: iv.counts?.minima ?? iv.result?.minima.length ?? 0,
  }));
}
