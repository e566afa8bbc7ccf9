/** Observed vs predicted power of one station/component (log scale), and its weighted residuals. */
import type * as Plot from '@observablehq/plot';
import type { FigureSpec } from '@/src/web/charts/figure-spec';
import type { SeriesFit } from '@/src/runs/fits';
import { FIGURE } from '@/src/design/tokens';

/** Display units per component: field power in SI times k. */
export const POWER_UNIT: Record<string, { k: number; unit: string }> = {
  Ez: { k: 1e6, unit: '(mV/m)²/Hz' },
  Bns: { k: 1e24, unit: 'pT²/Hz' },
  Bew: { k: 1e24, unit: 'pT²/Hz' },
};

export function fitFigures(s: SeriesFit): { power: FigureSpec; residual: FigureSpec } {
  const u = POWER_UNIT[s.component];
  const pts = s.frequencies.map((f, i) => ({ f, obs: s.observed[i] * u.k, pred: s.predicted[i] * u.k, res: s.residual[i] }));
  return {
    power: {
      title: `Power at ${s.station}, ${s.component}`,
      xLabel: 'Frequency (Hz)',
      yLabel: `Power spectral density (${u.unit})`,
      height: 260,
      build: (P) =>
        ({
          y: { type: 'log' },
          color: { legend: true, domain: ['observed', 'predicted'], range: [FIGURE.observed, FIGURE.predicted] },
          marks: [
            P.dot(pts, {
              x: 'f',
              y: 'obs',
              r: 2,
              fill: () => 'observed',
              title: (d: { f: number; obs: number }) => `${d.f} Hz: ${d.obs.toExponential(3)}`,
            }),
            P.line(pts, { x: 'f', y: 'pred', stroke: () => 'predicted', strokeWidth: 1.5 }),
          ],
        }) as unknown as Plot.PlotOptions,
    },
    residual: {
      title: 'Weighted residuals',
      xLabel: 'Frequency (Hz)',
      yLabel: '(ln P_pred − ln P_obs) / σ (dimensionless)',
      height: 160,
      build: (P) =>
        ({
          marks: [
            P.ruleY([0]),
            P.ruleY([-2, 2], { strokeDasharray: '3 3', strokeOpacity: 0.5 }),
            P.dot(pts, { x: 'f', y: 'res', r: 2, fill: FIGURE.observed }),
          ],
        }) as Plot.PlotOptions,
    },
  };
}
