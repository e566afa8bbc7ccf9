'use client';
/** Daily curves of each region's intensity (`seriesFigure`). */
import { useMemo } from 'react';
import { PlotFigure } from '@/src/web/charts/PlotFigure';
import type { IntervalView } from '@/src/runs/results';
import { seriesFigure } from './figures/series';

export function SeriesCurves({
  intervals,
  colours,
  prerendered,
}: {
  intervals: IntervalView[];
  colours: Record<string, string>;
  prerendered?: string | null;
}) {
  const spec = useMemo(() => seriesFigure(intervals, colours), [intervals, colours]);
  return <PlotFigure {...spec} options={spec.build} prerendered={prerendered} />;
}
