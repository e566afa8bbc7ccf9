'use client';
/** Observed vs predicted power per station/component (`fitFigures`) with the weighted residuals below. */
import { useMemo, useState } from 'react';
import { PlotFigure } from '@/src/web/charts/PlotFigure';
import { Notice } from '@/src/web/ui/Notice';
import { useApi } from '@/src/web/swr';
import type { RunFits, SeriesFit } from '@/src/runs/fits';
import { fitFigures } from './figures/fits';
import { fitsUrl } from './types';
import { formatValue } from '@/src/web/ui/format';

/**
 * The fits of one minimum of one interval. They never change once the interval is solved, so an
 * answer in the cache (the page's first view brings its own, as SWR `fallback`) is not fetched again.
 */
export function useFits(base: string, interval: string | null, minimum: number) {
  return useApi<RunFits>(interval ? fitsUrl(base, interval, minimum) : null, {
    revalidateIfStale: false,
    revalidateOnFocus: false,
    revalidateOnReconnect: false,
  });
}

/** The server's drawings of the first series' figures (`renderFigureSvg`). */
export interface FitsPrerendered {
  power: string | null;
  residual: string | null;
}

export function FitsPanel({
  fits,
  error,
  prerendered,
}: {
  fits: { series: SeriesFit[] } | undefined;
  error?: Error;
  prerendered?: FitsPrerendered | null;
}) {
  const [pick, setPick] = useState(0);
  const s = fits?.series[Math.min(pick, (fits?.series.length ?? 1) - 1)];
  const specs = useMemo(() => (s ? fitFigures(s) : null), [s]);
  if (error)
    return (
      <Notice tone="error" title="The fits could not be loaded">
        {error.message}
      </Notice>
    );
  if (!fits) return <p className="text-sm text-muted">Loading fits…</p>;
  if (!s || !specs) return <p className="text-sm text-muted">No series in this interval.</p>;
  const first = pick === 0 ? prerendered : null;
  return (
    <div className="space-y-2">
      <label className="text-sm">
        Station and component{' '}
        <select
          className="ml-2 rounded border border-line-strong bg-surface px-2 py-1"
          value={pick}
          onChange={(e) => setPick(Number(e.target.value))}
        >
          {fits.series.map((x, i) => (
            <option key={i} value={i}>
              {x.station} {x.component} (χ²/bin {formatValue(x.chi2PerBin)})
            </option>
          ))}
        </select>
      </label>
      <PlotFigure {...specs.power} options={specs.power.build} prerendered={first?.power} />
      <PlotFigure {...specs.residual} options={specs.residual.build} prerendered={first?.residual} />
    </div>
  );
}
