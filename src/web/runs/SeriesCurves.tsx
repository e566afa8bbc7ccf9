'use client';
/** Daily curves of each region's intensity (`seriesFigure`). */
import { useMemo } from 'react';
import { PlotFigure } from '@/src/web/charts/PlotFigure';
import type { IntervalView } from '@/src/runs/results';
import type { RunGoodness } from '@/src/runs/goodness';
import { seriesFigure } from './figures/series';

export function SeriesCurves({
  intervals,
  colours,
  goodness,
  prerendered,
}: {
  intervals: IntervalView[];
  colours: Record<string, string>;
  /** Marks the intervals whose fit is implausible. */
  goodness?: RunGoodness;
  prerendered?: string | null;
}) {
  const spec = useMemo(() => seriesFigure(intervals, colours, goodness), [intervals, colours, goodness]);
  return <PlotFigure {...spec} options={spec.build} prerendered={prerendered} />;
}
