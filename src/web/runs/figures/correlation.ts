/** Correlation matrix of one minimum on a diverging scale centred on zero; values show on hover. */
import type * as Plot from '@observablehq/plot';
import type { FigureSpec } from '@/src/web/charts/figure-spec';
import { RAMPS } from '@/src/design/tokens';
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
          P.text(cells, { x: 'b', y: 'a', text: (d: { r: number }) => d.r.toFixed(2), fontSize: 10 }),
        ],
      }) as Plot.PlotOptions,
  };
}
