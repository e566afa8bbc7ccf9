'use client';
/** Correlation matrix of the selected minimum on a diverging scale centred on zero; values show on hover. */
import { useMemo } from 'react';
import type * as Plot from '@observablehq/plot';
import { PlotFigure } from '@/src/web/charts/PlotFigure';
import type { PlotModule } from '@/src/web/charts/plot-module';
import { DIVERGING_SIGNED } from '@/src/web/charts/scales';
import type { Minimum } from './types';

export function CorrelationHeatmap({ minimum }: { minimum: Minimum }) {
  const { names, matrix } = minimum.correlation;
  const options = useMemo(() => {
    const cells = names.flatMap((a, i) => names.map((b, j) => ({ a, b, r: matrix[i][j] })));
    return (Plot: PlotModule) => ({
      marginLeft: 110, marginBottom: 90,
      x: { domain: names, tickRotate: -35 },
      y: { domain: names },
      color: { type: 'linear', scheme: DIVERGING_SIGNED, domain: [-1, 1], pivot: 0, legend: true, label: 'correlation (dimensionless)' },
      marks: [
        Plot.cell(cells, { x: 'b', y: 'a', fill: 'r', tip: true, title: (d: { a: string; b: string; r: number }) => `${d.a} × ${d.b}: ${d.r.toFixed(3)}` }),
        Plot.text(cells, { x: 'b', y: 'a', text: (d: { r: number }) => d.r.toFixed(2), fontSize: 10 }),
      ],
    }) as Plot.PlotOptions;
  }, [names, matrix]);
  return <PlotFigure title="Correlation matrix of the parameters" xLabel="Parameter (internal: ln intensity, degrees)" yLabel="Parameter"
    caption={minimum.singular ? 'The normal matrix is singular: some parameter combination is not resolved by the data.' : 'C_ij / sqrt(C_ii C_jj) from the covariance at this minimum.'}
    height={Math.max(220, 48 * names.length + 100)} options={options} />;
}
