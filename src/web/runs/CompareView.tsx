'use client';
/**
 * Two runs side by side: their settings in brief, the best minimum of each interval, and both
 * intensity series with their error bands on one UT axis, each region in one colour for both (`colours`).
 */
import { useMemo } from 'react';
import { PlotFigure } from '@/src/web/charts/PlotFigure';
import type { RunView } from '@/src/runs/results';
import { formatMeasured, formatValue } from '@/src/web/ui/format';
import { goodnessOf } from '@/src/runs/goodness';
import { compareSeriesFigure } from './figures/compare-series';

function bestRows(v: RunView) {
  return v.intervals.flatMap((iv) => {
    const m = iv.result?.minima[0];
    const g = m && iv.result ? goodnessOf(m.misfit, iv.nData - iv.result.nParams) : null;
    return m ? [{ t: iv.startsAt, misfit: m.misfit, reduced: m.reducedChi2, sources: m.sources, errors: m.stdErrors, g }] : [];
  });
}

export function CompareView({ a, b, colours }: { a: RunView; b: RunView; colours: Record<string, string> }) {
  const runs = [a, b];
  const spec = useMemo(() => compareSeriesFigure(a.intervals, b.intervals, colours), [a, b, colours]);
  return (
    <div className="space-y-6">
      <div className="grid gap-6 lg:grid-cols-2">
        {runs.map((v, k) => (
          <section key={v.run.id} className="rounded border border-line p-4 text-sm" aria-label={`Run ${k === 0 ? 'A' : 'B'}`}>
            <h3 className="font-semibold">
              {k === 0 ? 'A' : 'B'}: {v.run.name}
            </h3>
            <p className="text-muted">
              {v.model.name} v{v.model.version} · {v.grid.name} v{v.grid.version} · {v.config.starts} starts, seed {v.config.seed}{' '}
              · {v.run.state} · errors {v.errorsScaledByMisfit ? 'scaled by the misfit where χ²/dof > 1' : 'as stated'}
            </p>
            <table className="mt-3 w-full tabular-nums">
              <thead className="text-left text-muted">
                <tr>
                  <th>Interval (UT)</th>
                  <th className="text-right">χ²</th>
                  <th className="text-right">Reduced χ²</th>
                  <th className="text-right">P(≥ χ²)</th>
                  <th className="text-right">Intensities (C² km²/s)</th>
                </tr>
              </thead>
              <tbody>
                {bestRows(v).map((r) => (
                  <tr key={r.t} className="border-t border-line/60">
                    <td>{r.t.slice(0, 16).replace('T', ' ')}</td>
                    <td className="text-right">{formatValue(r.misfit, '', 5)}</td>
                    <td className="text-right">{formatValue(r.reduced)}</td>
                    <td className="text-right">
                      {formatValue(r.g?.p, '', 2)}
                      {r.g?.implausible ? <span className="ml-1 text-xs font-semibold text-danger">implausible</span> : null}
                    </td>
                    <td className="text-right">
                      {r.sources.map((s) => `${s.name} ${formatMeasured(s.intensity, r.errors[s.name]?.intensity)}`).join('; ')}
                    </td>
                  </tr>
                ))}
              </tbody>
            </table>
          </section>
        ))}
      </div>
      <PlotFigure {...spec} options={spec.build} />
    </div>
  );
}
