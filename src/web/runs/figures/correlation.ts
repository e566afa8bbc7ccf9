/**
 * Correlation matrix of one minimum on the diverging ramp (pale = 0); each cell's value is written
 * in black or white, whichever meets WCAG 2.1 contrast on that cell.
 */
import type * as Plot from '@observablehq/plot';
import type { FigureSpec } from '@/src/web/charts/figure-spec';
import { RAMPS, inkOn } from '@/src/design/tokens';
import type { Minimum } from '@/src/engine/inverse/types';

export function correlationFigure(minimum: Minimum): FigureSpec {
  const { names, matrix } = minimum.correlation;
  const cells = names.flatMap((a, i) => names.map((b, j) => ({ a, b, r: matrix[i][j] })));
  return {
    title: 'Correlation matrix of the parameters',
    xLabel: 'Parameter (internal: ln intensity, degrees)',
    yLabel: 'Parameter',
    caption: minimum.singular
      ? 'The normal matrix is singular: some parameter combination is not resolved by the data.'
      : 'C_ij / sqrt(C_ii C_jj) from the covariance at this minimum.',
    height: Math.max(220, 48 * names.length + 100),
    build: (P) =>
      ({
        marginLeft: 110,
        marginBottom: 90,
        x: { domain: names, tickRotate: -35 },
        y: { domain: names },
        color: {
          type: 'linear',
          interpolate: RAMPS.signed,
          domain: [-1, 1],
          legend: true,
          label: 'correlation (dimensionless)',
        },
        marks: [
          P.cell(cells, {
            x: 'b',
            y: 'a',
            fill: 'r',
            tip: true,
            title: (d: { a: string; b: string; r: number }) => `${d.a} × ${d.b}: ${d.r.toFixed(3)}`,
          }),
          P.text(cells, {
            x: 'b',
            y: 'a',
            text: (d: { r: number }) => d.r.toFixed(2).replace('-', '−'),
            fill: { value: (d: { r: number }) => inkOn(RAMPS.signed((d.r + 1) / 2)), scale: null },
            fontSize: 10,
          }),
        ],
      }) as Plot.PlotOptions,
  };
}
