'use client';
/** Correlation matrix of the selected minimum (`correlationFigure`); values show on hover. */
import { useMemo } from 'react';
import { PlotFigure } from '@/src/web/charts/PlotFigure';
import { correlationFigure } from './figures/correlation';
import type { Minimum } from './types';

export function CorrelationHeatmap({ minimum, prerendered }: { minimum: Minimum; prerendered?: string | null }) {
  const spec = useMemo(() => correlationFigure(minimum), [minimum]);
  return <PlotFigure {...spec} options={spec.build} prerendered={prerendered} />;
}
