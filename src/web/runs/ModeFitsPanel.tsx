'use client';
/**
 * How well a minimum of a mode-parameter run fits: for one station and
 * component, observed and predicted frequency, peak intensity and half-width
 * of every mode (observed with ±1σ bars), then a sortable table of the
 * weighted residuals of every station, component and mode.
 */
import { useMemo, useState } from 'react';
import type * as Plot from '@observablehq/plot';
import { PlotFigure } from '@/src/web/charts/PlotFigure';
import type { PlotModule } from '@/src/web/charts/plot-module';
import { Notice } from '@/src/web/ui';
import { SortHeader, useSort } from '@/src/web/ui/SortHeader';
import type { ModeFit } from '@/src/runs/fits';
import { formatMeasured, formatValue } from '@/src/web/ui/format';
import { FIGURE } from '@/src/design/tokens';

const UNIT: Record<ModeFit['component'], { k: number; unit: string }> = {
  Ez: { k: 1e6, unit: '(mV/m)²/Hz' },
  Bns: { k: 1e24, unit: 'pT²/Hz' },
  Bew: { k: 1e24, unit: 'pT²/Hz' },
};
const OBSERVED = FIGURE.observed;
const PREDICTED = FIGURE.predicted;

type Row = { key: string; station: string; component: string; mode: number; rf: number; ri: number; rg: number; chi2: number };
type SortKey = keyof Omit<Row, 'key'>;

interface Point {
  mode: number;
  obs: number;
  lo: number;
  hi: number;
  pred: number;
  what: string;
}

function points(list: ModeFit[], pick: 'frequency' | 'intensity' | 'halfWidth', k: number, unit: string): Point[] {
  return list.map((m) => {
    const obs = m.observed[pick] * k;
    const pred = m.predicted[pick] * k;
    // the intensity's sigma is that of ln(intensity): a factor exp(±σ) around the observed value
    const [lo, hi] =
      pick === 'intensity'
        ? [obs * Math.exp(-m.sigma.logIntensity), obs * Math.exp(m.sigma.logIntensity)]
        : [obs - m.sigma[pick], obs + m.sigma[pick]];
    return {
      mode: m.mode,
      obs,
      lo,
      hi,
      pred,
      what:
        pick === 'intensity'
          ? `mode ${m.mode}: observed ${formatValue(obs, unit)} (${formatValue(lo)} to ${formatValue(hi)}), predicted ${formatValue(pred, unit)}`
          : `mode ${m.mode}: observed ${formatMeasured(obs, m.sigma[pick], unit)}, predicted ${formatValue(pred, unit, 4)}`,
    };
  });
}

function figure(pts: Point[], log: boolean) {
  return (P: PlotModule) =>
    ({
      x: { domain: pts.map((p) => p.mode), type: 'point', padding: 0.6, tickFormat: (d: number) => `${d}` },
      y: log ? { type: 'log', tickFormat: '~e' } : { nice: true },
      color: { legend: true, domain: ['observed ±1σ', 'predicted'], range: [OBSERVED, PREDICTED] },
      marks: [
        // observed a little left of the mode's position, predicted a little right, so neither hides the other
        P.ruleX(pts, { x: 'mode', y1: 'lo', y2: 'hi', dx: -5, stroke: OBSERVED, strokeWidth: 2 }),
        P.dot(pts, { x: 'mode', y: 'obs', dx: -5, r: 3.5, fill: () => 'observed ±1σ', title: 'what', tip: true }),
        P.dot(pts, { x: 'mode', y: 'pred', dx: 5, r: 4.5, symbol: 'diamond', fill: () => 'predicted', title: 'what' }),
      ],
    }) as unknown as Plot.PlotOptions;
}

function ResidualTable({ modes }: { modes: ModeFit[] }) {
  const [sort, toggleSort] = useSort<SortKey>({ key: 'chi2', desc: true });
  const rows = useMemo(() => {
    const r: Row[] = modes.map((m) => ({
      key: `${m.station}/${m.component}/${m.mode}`,
      station: m.station,
      component: m.component,
      mode: m.mode,
      rf: m.residual.frequency,
      ri: m.residual.logIntensity,
      rg: m.residual.halfWidth,
      chi2: m.residual.frequency ** 2 + m.residual.logIntensity ** 2 + m.residual.halfWidth ** 2,
    }));
    const sign = sort.desc ? -1 : 1;
    return r.sort((a, b) => {
      const x = a[sort.key];
      const y = b[sort.key];
      return sign * (typeof x === 'number' && typeof y === 'number' ? x - y : String(x).localeCompare(String(y)));
    });
  }, [modes, sort]);
  const head = (key: SortKey, label: string, left = false) => (
    <SortHeader column={key} sort={sort} onSort={toggleSort} align={left ? 'left' : 'right'}>
      {label}
    </SortHeader>
  );
  // |r| above 2 means more than two standard deviations off (common practice)
  const cell = (v: number) => (
    <td className={`px-2 py-1 text-right ${Math.abs(v) > 2 ? 'font-semibold text-danger' : ''}`}>{formatValue(v)}</td>
  );
  return (
    <div className="max-h-96 overflow-auto">
      <table className="w-full text-sm tabular-nums" data-testid="mode-residuals">
        <caption className="mb-1 text-left text-sm font-semibold">
          Weighted residuals (predicted − observed) / σ, every station, component and mode
        </caption>
        <thead className="sticky top-0 border-b border-line bg-surface text-muted">
          <tr>
            {head('station', 'Station', true)}
            {head('component', 'Component', true)}
            {head('mode', 'Mode')}
            {head('rf', 'Frequency (σ)')}
            {head('ri', 'ln intensity (σ)')}
            {head('rg', 'Half-width (σ)')}
            {head('chi2', 'χ² of the mode')}
          </tr>
        </thead>
        <tbody>
          {rows.map((r) => (
            <tr key={r.key} className="border-b border-line/60">
              <td className="px-2 py-1">{r.station}</td>
              <td className="px-2 py-1">{r.component}</td>
              <td className="px-2 py-1 text-right">{r.mode}</td>
              {cell(r.rf)}
              {cell(r.ri)}
              {cell(r.rg)}
              <td className="px-2 py-1 text-right">{formatValue(r.chi2)}</td>
            </tr>
          ))}
        </tbody>
      </table>
      <p className="mt-1 text-xs text-muted">
        Residuals beyond ±2σ are marked. Sort on any column; the misfit χ² of the minimum is the sum of the last column.
      </p>
    </div>
  );
}

export function ModeFitsPanel({
  fits,
  error,
}: {
  fits: { series: unknown[]; modes?: ModeFit[]; assumedExclusions?: string[] } | undefined;
  error?: Error;
}) {
  const pairs = useMemo(() => {
    const seen = new Map<string, { station: string; component: ModeFit['component'] }>();
    for (const m of fits?.modes ?? []) seen.set(`${m.station} ${m.component}`, { station: m.station, component: m.component });
    return [...seen.entries()];
  }, [fits]);
  const [pick, setPick] = useState(0);
  const chosen = pairs[Math.min(pick, pairs.length - 1)];
  const figs = useMemo(() => {
    if (!chosen || !fits?.modes) return null;
    const [, { station, component }] = chosen;
    const list = fits.modes.filter((m) => m.station === station && m.component === component).sort((a, b) => a.mode - b.mode);
    const u = UNIT[component];
    return {
      unit: u.unit,
      frequency: figure(points(list, 'frequency', 1, 'Hz'), false),
      intensity: figure(points(list, 'intensity', u.k, u.unit), true),
      halfWidth: figure(points(list, 'halfWidth', 1, 'Hz'), false),
    };
  }, [chosen, fits]);
  if (error)
    return (
      <Notice tone="error" title="The mode fits could not be loaded">
        {error.message}
      </Notice>
    );
  if (!fits) return <p className="text-sm text-muted">Loading mode fits…</p>;
  if (!fits.modes)
    return (
      <p className="text-sm text-muted">
        The server sent no mode comparison for this minimum. Reload the page once the service has been updated.
      </p>
    );
  if (!chosen || !figs)
    return (
      <p className="text-sm text-muted">
        No observed modes in this interval: the stations&apos; mode fits for it may have been removed. Fit the interval&apos;s
        spectra again, then run again.
      </p>
    );
  const [label, { station, component }] = chosen;
  return (
    <div className="space-y-4" data-testid="mode-fits">
      {pairs.length > 1 ? (
        <label className="text-sm">
          Station and component{' '}
          <select
            className="ml-2 rounded border border-line-strong bg-surface px-2 py-1"
            value={Math.min(pick, pairs.length - 1)}
            onChange={(e) => setPick(Number(e.target.value))}
          >
            {pairs.map(([l], i) => (
              <option key={l} value={i}>
                {l}
              </option>
            ))}
          </select>
        </label>
      ) : (
        <p className="text-sm">{label}</p>
      )}
      <div className="grid gap-4 lg:grid-cols-3">
        <PlotFigure
          title={`Mode frequency, ${station} ${component}`}
          xLabel="Mode number"
          yLabel="Frequency (Hz)"
          options={figs.frequency}
          height={220}
        />
        <PlotFigure
          title={`Peak intensity, ${station} ${component}`}
          xLabel="Mode number"
          yLabel={`Peak power density (${figs.unit})`}
          options={figs.intensity}
          height={220}
        />
        <PlotFigure
          title={`Half-width, ${station} ${component}`}
          xLabel="Mode number"
          yLabel="Half-width at half maximum (Hz)"
          options={figs.halfWidth}
          height={220}
        />
      </div>
      {fits.assumedExclusions?.length ? (
        <Notice tone="storm" title="Left-out lines assumed">
          The stored mode fits of {fits.assumedExclusions.join(', ')} were made before fits recorded the frequency ranges they
          left out. Their predicted modes were fitted without the station&apos;s mains and listed interference lines as the
          station is set up now; if the observed fit kept those bins, the comparison is off. Fit the interval&apos;s spectra again
          to record them.
        </Notice>
      ) : null}
      <ResidualTable modes={fits.modes} />
    </div>
  );
}
