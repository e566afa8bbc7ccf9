'use client';
/** Observed vs predicted power per station/component (log scale) with the weighted residuals below. */
import { useMemo, useState } from 'react';
import type * as Plot from '@observablehq/plot';
import { PlotFigure } from '@/src/web/charts/PlotFigure';
import type { PlotModule } from '@/src/web/charts/plot-module';
import { Notice } from '@/src/web/ui/Notice';
import { useApi } from '@/src/web/swr';
import type { SeriesFit, StationFit } from '@/src/runs/fits';
import { fitsUrl, fmt } from './types';

const UNIT: Record<string, { k: number; unit: string }> = { Ez: { k: 1e6, unit: '(mV/m)²/Hz' }, Bns: { k: 1e24, unit: 'pT²/Hz' }, Bew: { k: 1e24, unit: 'pT²/Hz' } };

export function useFits(base: string, interval: string | null, minimum: number) {
  return useApi<{ series: SeriesFit[]; stations: StationFit[] }>(interval ? fitsUrl(base, interval, minimum) : null);
}

export function FitsPanel({ fits, error }: { fits: { series: SeriesFit[] } | undefined; error?: Error }) {
  const [pick, setPick] = useState(0);
  const s = fits?.series[Math.min(pick, (fits?.series.length ?? 1) - 1)];
  const opts = useMemo(() => {
    if (!s) return null;
    const u = UNIT[s.component];
    const pts = s.frequencies.map((f, i) => ({ f, obs: s.observed[i] * u.k, pred: s.predicted[i] * u.k, res: s.residual[i] }));
    return {
      unit: u.unit,
      power: (Plot: PlotModule) => ({
        y: { type: 'log' }, color: { legend: true, domain: ['observed', 'predicted'], range: ['#0072B2', '#E69F00'] },
        marks: [
          Plot.dot(pts, { x: 'f', y: 'obs', r: 2, fill: () => 'observed', title: (d: { f: number; obs: number }) => `${d.f} Hz: ${d.obs.toExponential(3)}` }),
          Plot.line(pts, { x: 'f', y: 'pred', stroke: () => 'predicted', strokeWidth: 1.5 }),
        ],
      }) as unknown as Plot.PlotOptions,
      residual: (Plot: PlotModule) => ({
        marks: [Plot.ruleY([0]), Plot.ruleY([-2, 2], { strokeDasharray: '3 3', strokeOpacity: 0.5 }), Plot.dot(pts, { x: 'f', y: 'res', r: 2, fill: '#0072B2' })],
      }) as Plot.PlotOptions,
    };
  }, [s]);
  if (error) return <Notice tone="error" title="The fits could not be loaded">{error.message}</Notice>;
  if (!fits) return <p className="text-sm text-muted">Loading fits…</p>;
  if (!s || !opts) return <p className="text-sm text-muted">No series in this interval.</p>;
  return (
    <div className="space-y-2">
      <label className="text-sm">Station and component{' '}
        <select className="ml-2 rounded border border-line-strong bg-surface px-2 py-1" value={pick} onChange={(e) => setPick(Number(e.target.value))}>
          {fits.series.map((x, i) => <option key={i} value={i}>{x.station} {x.component} (χ²/bin {fmt(x.chi2PerBin)})</option>)}
        </select>
      </label>
      <PlotFigure title={`Power at ${s.station}, ${s.component}`} xLabel="Frequency (Hz)" yLabel={`Power spectral density (${opts.unit})`} options={opts.power} height={260} />
      <PlotFigure title="Weighted residuals" xLabel="Frequency (Hz)" yLabel="(ln P_pred − ln P_obs) / σ (dimensionless)" options={opts.residual} height={160} />
    </div>
  );
}
