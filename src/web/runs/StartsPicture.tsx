'use client';
/**
 * The multi-start picture: one dot per start, placed at the misfit of the
 * minimum it ended in, grouped by minimum (x) — how often each minimum was found.
 */
import { useMemo } from 'react';
import type * as Plot from '@observablehq/plot';
import { PlotFigure } from '@/src/web/charts/PlotFigure';
import type { PlotModule } from '@/src/web/charts/plot-module';
import type { InversionResult } from './types';

export function StartsPicture({ result, selected }: { result: InversionResult; selected: number }) {
  const options = useMemo(() => {
    const dots = result.minima.flatMap((m, i) => m.startIndexes.map((s, k) => ({
      x: i + 1 + (((k % 9) - 4) * 0.07), misfit: m.misfit, start: s, chosen: i === selected,
    })));
    return (Plot: PlotModule) => ({
      x: { domain: [0.4, result.minima.length + 0.6], ticks: result.minima.map((_, i) => i + 1), tickFormat: (d: number) => `#${d}` },
      y: { type: 'log' },
      marks: [
        Plot.dot(dots, {
          x: 'x', y: 'misfit', r: 3,
          fill: (d: { chosen: boolean }) => (d.chosen ? '#E69F00' : '#0072B2'),
          title: (d: { start: number; misfit: number }) => `start ${d.start}: misfit ${d.misfit.toPrecision(5)}`,
        }),
      ],
    }) as unknown as Plot.PlotOptions;
  }, [result, selected]);
  return <PlotFigure title={`Where the ${result.starts} starts ended`} xLabel="Minimum (rank)" yLabel="Final misfit χ² (dimensionless)"
    caption={`${result.unconverged} starts did not converge and are counted with the nearest minimum.`} options={options} height={240} />;
}
