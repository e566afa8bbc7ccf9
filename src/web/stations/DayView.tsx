'use client';
/**
 * One station, one component, one UTC day: spectrogram (interval × frequency),
 * mode frequency / Q / intensity over time, the intervals table with quality
 * flags and flagging, and the spectrum of a chosen interval with its fit.
 */
import { useMemo, useState } from 'react';
import * as Plot from '@observablehq/plot';
import { PlotFigure } from '@/src/web/charts/PlotFigure';
import { Badge, Button, DataTable, EmptyState, FormField, Notice, inputClass } from '@/src/web/ui';
import { apiSend, ApiError, useApi } from '@/src/web/swr';
import { COMPONENT_INFO, type Component } from '@/src/engine/components';
import { displayFactor } from '@/src/engine/forward/units';
import { FitSettings } from './FitSettings';
import { RAMPS } from '@/src/design/tokens';
import { fittedCurve, qFactorError } from './fit-curve';

interface Mode {
  frequency: number;
  amplitude: number;
  halfWidth: number;
  q: number;
  errors: { frequency: number; amplitude: number; halfWidth: number };
}
interface Fit {
  modes: Mode[];
  background: { b0: number; b1: number };
  misfit: number;
  band?: { minHz: number; maxHz: number };
  averages?: number;
  excluded?: { minHz: number; maxHz: number }[];
}
interface Interval {
  id: string;
  component: string;
  startsAt: string;
  rejectedShare: number;
  qualityFlags: string[];
  flagReason: string | null;
  fit: Fit | null;
}
interface Spectrum {
  intervalId: string;
  startsAt: string;
  frequencies: number[];
  power: number[];
  segments: number;
}

const SLOT_MS = 600_000;

/** SI power in the display units of a component ((mV/m)^2/Hz for Ez, pT^2/Hz for the coils). */
const toDisplayPower = (component: string, p: number) => p * displayFactor(component as Component);

/** The fitted model P(f) = sum A_n / (1 + ((f - f_n)/g_n)^2) + b0 + b1 f (Lorentzian modes plus linear background). */

export function DayView({
  networkId,
  stationId,
  components,
  days,
  canFlag,
}: {
  networkId: string;
  stationId: string;
  components: string[];
  days: string[];
  canFlag: boolean;
}) {
  const [day, setDay] = useState(days[0] ?? '');
  const [component, setComponent] = useState(components[0] ?? 'Ez');
  const [chosen, setChosen] = useState<string | null>(null);
  const [show, setShow] = useState<'all' | 'clean' | 'quality' | 'flagged'>('all');
  const q = `station=${stationId}&day=${day}&component=${component}&flagged=include`;
  const base = `/api/networks/${networkId}`;
  const list = useApi<{ intervals: Interval[] }>(day ? `${base}/intervals?${q}` : null);
  const spec = useApi<{ spectra: Spectrum[] }>(day ? `${base}/intervals/spectra?${q}&minHz=3&maxHz=45` : null);
  const unit = COMPONENT_INFO[component as Component].displayUnit;
  const dayStart = Date.parse(`${day}T00:00:00Z`);
  const intervals = useMemo(() => list.data?.intervals ?? [], [list.data]);

  const raster = useMemo(() => {
    const spectra = spec.data?.spectra ?? [];
    if (!spectra.length) return null;
    const freqs = spectra[0].frequencies;
    const ny = freqs.length;
    const nx = 144;
    const values = new Float64Array(nx * ny).fill(NaN);
    for (const s of spectra) {
      const col = Math.floor((Date.parse(s.startsAt) - dayStart) / SLOT_MS);
      if (col < 0 || col >= nx) continue;
      for (let j = 0; j < ny && j < s.power.length; j++) {
        const p = toDisplayPower(component, s.power[j]);
        values[(ny - 1 - j) * nx + col] = p > 0 ? Math.log10(p) : NaN;
      }
    }
    return { values, nx, ny, fMin: freqs[0], fMax: freqs[ny - 1] };
  }, [spec.data, dayStart, component]);

  const modePoints = useMemo(
    () =>
      intervals.flatMap((iv) =>
        (iv.fit?.modes ?? []).slice(0, 4).map((m, n) => ({
          t: new Date(iv.startsAt),
          mode: `mode ${n + 1}`,
          f: m.frequency,
          df: m.errors.frequency,
          q: m.q,
          dq: qFactorError(m),
          a: toDisplayPower(component, m.amplitude),
          da: toDisplayPower(component, m.errors.amplitude),
          flagged: !!iv.flagReason,
        })),
      ),
    [intervals, component],
  );

  const selected = intervals.find((i) => i.id === chosen) ?? null;
  const selectedSpectrum = spec.data?.spectra.find((s) => s.intervalId === chosen) ?? null;

  const [flagging, setFlagging] = useState<{ id: string; start: string; reason: string } | null>(null);
  const [flagError, setFlagError] = useState<string | null>(null);

  async function setFlag(id: string, body: { flagged: true; reason: string } | { flagged: false }) {
    setFlagError(null);
    try {
      await apiSend('PATCH', `${base}/intervals/${id}`, body);
      setFlagging(null);
      await list.mutate();
    } catch (e) {
      setFlagError(e instanceof ApiError ? e.message : String(e));
    }
  }

  function flag(iv: Interval) {
    if (iv.flagReason) void setFlag(iv.id, { flagged: false });
    else setFlagging({ id: iv.id, start: iv.startsAt, reason: '' });
  }

  if (!days.length) {
    return (
      <EmptyState title="No intervals yet">
        Upload a station file or set up a push token; processed intervals appear here by UTC day.
      </EmptyState>
    );
  }
  const shown = intervals.filter((iv) =>
    show === 'all'
      ? true
      : show === 'clean'
        ? !iv.qualityFlags.length && !iv.flagReason
        : show === 'quality'
          ? iv.qualityFlags.length > 0
          : !!iv.flagReason,
  );
  const rows = shown.map((iv) => ({
    id: iv.id,
    startsAt: iv.startsAt,
    rejected: iv.rejectedShare * 100,
    f1: iv.fit?.modes[0]?.frequency,
    q1: iv.fit?.modes[0]?.q,
    f2: iv.fit?.modes[1]?.frequency,
    misfit: iv.fit?.misfit,
    quality: iv.qualityFlags.join(', '),
    flag: iv.flagReason ?? '',
    raw: iv,
  }));
  // UTC clock times on the axis, the axis label centred under the ticks
  const timeX = {
    type: 'utc' as const,
    domain: [new Date(dayStart), new Date(dayStart + 86_400_000)],
    tickFormat: '%H:%M',
    labelAnchor: 'center' as const,
    labelOffset: 34,
  };

  return (
    <div className="space-y-6">
      <div className="flex flex-wrap gap-3">
        <FormField id="dv-day" label="UTC day">
          <select
            className={inputClass}
            value={day}
            onChange={(e) => {
              setDay(e.target.value);
              setChosen(null);
            }}
          >
            {days.map((d) => (
              <option key={d} value={d}>
                {d}
              </option>
            ))}
          </select>
        </FormField>
        <FormField id="dv-comp" label="Component">
          <select
            className={inputClass}
            value={component}
            onChange={(e) => {
              setComponent(e.target.value);
              setChosen(null);
            }}
          >
            {components.map((c) => (
              <option key={c} value={c}>
                {c}
              </option>
            ))}
          </select>
        </FormField>
        <FormField id="dv-show" label="Intervals in the table">
          <select className={inputClass} value={show} onChange={(e) => setShow(e.target.value as typeof show)}>
            <option value="all">all</option>
            <option value="clean">clean only</option>
            <option value="quality">with quality flags</option>
            <option value="flagged">flagged by a person</option>
          </select>
        </FormField>
      </div>
      {list.error ? <Notice tone="error">{String(list.error.message)}</Notice> : null}
      {raster ? (
        <PlotFigure
          title={`Spectrogram, ${component}, ${day}`}
          xLabel="Interval start (UTC)"
          yLabel="Frequency (Hz)"
          height={300}
          caption={`Colour: log10 of power spectral density in ${unit}; gaps are intervals without data.`}
          options={{
            marginBottom: 40,
            x: timeX,
            y: { domain: [raster.fMin, raster.fMax] },
            color: { type: 'linear', interpolate: RAMPS.depth, legend: true, label: `log10 PSD (${unit})` },
            marks: [
              Plot.raster(raster.values, {
                width: raster.nx,
                height: raster.ny,
                x1: dayStart,
                x2: dayStart + 86_400_000,
                y1: raster.fMax,
                y2: raster.fMin,
                imageRendering: 'pixelated',
              } as Plot.RasterOptions),
            ],
          }}
        />
      ) : (
        <p className="text-sm text-muted">{spec.isLoading ? 'Loading spectra…' : 'No spectra on this day.'}</p>
      )}
      {modePoints.length ? (
        <div className="grid gap-6 lg:grid-cols-3">
          <PlotFigure
            title="Mode frequencies"
            caption="Bars: ±1 standard error from each interval's mode fit."
            xLabel="Interval start (UTC)"
            yLabel="Frequency (Hz)"
            height={240}
            options={{
              marginBottom: 40,
              x: timeX,
              color: { legend: true },
              marks: [
                Plot.ruleX(modePoints, {
                  x: 't',
                  y1: (d: { f: number; df: number }) => d.f - d.df,
                  y2: (d: { f: number; df: number }) => d.f + d.df,
                  stroke: 'mode',
                  strokeOpacity: 0.7,
                }),
                Plot.dot(modePoints, { x: 't', y: 'f', fill: 'mode', r: 2 }),
              ],
            }}
          />
          <PlotFigure
            title="Q-factors"
            caption="Bars: ±1 standard error from each interval's mode fit."
            xLabel="Interval start (UTC)"
            yLabel="Q (dimensionless)"
            height={240}
            options={{
              marginBottom: 40,
              x: timeX,
              marks: [
                Plot.ruleX(
                  modePoints.filter((d) => Number.isFinite(d.dq)),
                  {
                    x: 't',
                    y1: (d: { q: number; dq: number }) => d.q - d.dq,
                    y2: (d: { q: number; dq: number }) => d.q + d.dq,
                    stroke: 'mode',
                    strokeOpacity: 0.7,
                  },
                ),
                Plot.dot(modePoints, { x: 't', y: 'q', fill: 'mode', r: 2 }),
              ],
            }}
          />
          <PlotFigure
            title="Mode intensities"
            caption="Bars: ±1 standard error from each interval's mode fit."
            xLabel="Interval start (UTC)"
            yLabel={`Peak amplitude (${unit})`}
            height={240}
            options={{
              marginBottom: 40,
              x: timeX,
              y: { type: 'log' },
              marks: [
                // on the log axis a bar reaching zero or below is cut at a hundredth of the value
                Plot.ruleX(
                  modePoints.filter((d) => d.a > 0 && Number.isFinite(d.da)),
                  {
                    x: 't',
                    y1: (d: { a: number; da: number }) => Math.max(d.a - d.da, d.a / 100),
                    y2: (d: { a: number; da: number }) => d.a + d.da,
                    stroke: 'mode',
                    strokeOpacity: 0.7,
                  },
                ),
                Plot.dot(
                  modePoints.filter((d) => d.a > 0),
                  { x: 't', y: 'a', fill: 'mode', r: 2 },
                ),
              ],
            }}
          />
        </div>
      ) : null}
      {selected && selectedSpectrum ? (
        <>
          <SpectrumWithFit interval={selected} spectrum={selectedSpectrum} component={component} unit={unit} />
          <p className="text-sm">
            <a
              href={`${base}/intervals/${selected.id}/spectrum`}
              download
              className="text-accent underline-offset-2 hover:underline"
            >
              Download this spectrum (CSV, SI units)
            </a>
          </p>
        </>
      ) : null}
      {flagging ? (
        <form
          className="flex flex-wrap items-end gap-3 rounded-[var(--radius-card)] border border-line bg-surface p-3"
          onSubmit={(e) => {
            e.preventDefault();
            void setFlag(flagging.id, { flagged: true, reason: flagging.reason });
          }}
        >
          <FormField
            id="dv-flag-reason"
            label={`Why should runs leave out the interval from ${flagging.start.slice(11, 16)} UTC?`}
            error={flagError}
            className="min-w-80 flex-1"
          >
            <input
              className={inputClass}
              value={flagging.reason}
              autoFocus
              onChange={(e) => setFlagging({ ...flagging, reason: e.target.value })}
              placeholder="e.g. generator running next to the antenna"
            />
          </FormField>
          <Button type="submit" size="sm">
            Flag interval
          </Button>
          <Button
            type="button"
            size="sm"
            tone="quiet"
            onClick={() => {
              setFlagging(null);
              setFlagError(null);
            }}
          >
            Cancel
          </Button>
        </form>
      ) : flagError ? (
        <Notice tone="error">{flagError}</Notice>
      ) : null}
      <DataTable
        caption={`Intervals, ${component}, ${day}`}
        rows={rows}
        initialSort={{ key: 'startsAt' }}
        className="max-h-[36rem] overflow-y-auto"
        empty={<EmptyState title="No intervals to show">Pick another day, component or table filter.</EmptyState>}
        columns={[
          { key: 'startsAt', header: 'Start', time: true },
          { key: 'rejected', header: 'Rejected', unit: '%', numeric: true, digits: 1 },
          { key: 'f1', header: 'f₁', unit: 'Hz', numeric: true, digits: 2 },
          { key: 'q1', header: 'Q₁', numeric: true, digits: 1 },
          { key: 'f2', header: 'f₂', unit: 'Hz', numeric: true, digits: 2 },
          { key: 'misfit', header: 'Fit misfit', numeric: true, digits: 1 },
          {
            key: 'quality',
            header: 'Quality',
            render: (r) => (r.quality ? <Badge tone="storm">{String(r.quality)}</Badge> : <Badge tone="ok">clean</Badge>),
          },
          { key: 'flag', header: 'Flag', render: (r) => (r.flag ? <Badge tone="danger">{String(r.flag)}</Badge> : '') },
          {
            key: 'id',
            header: '',
            sortable: false,
            render: (r) => (
              <span className="flex gap-2">
                <Button size="sm" tone="quiet" onClick={() => setChosen(String(r.id))}>
                  Spectrum
                </Button>
                {canFlag ? (
                  <Button size="sm" tone="secondary" onClick={() => flag(r.raw as Interval)}>
                    {r.flag ? 'Unflag' : 'Flag'}
                  </Button>
                ) : null}
              </span>
            ),
          },
        ]}
      />
    </div>
  );
}

function SpectrumWithFit({
  interval,
  spectrum,
  component,
  unit,
}: {
  interval: Interval;
  spectrum: Spectrum;
  component: string;
  unit: string;
}) {
  const pts = spectrum.frequencies.map((f, i) => ({ f, p: toDisplayPower(component, spectrum.power[i]) })).filter((d) => d.p > 0);
  const fit = interval.fit;
  const halfBin = spectrum.frequencies.length > 1 ? (spectrum.frequencies[1] - spectrum.frequencies[0]) / 2 : 0.05;
  const model = fit ? fittedCurve(fit, spectrum.frequencies).map((d) => ({ f: d.f, p: toDisplayPower(component, d.p) })) : [];
  return (
    <div className="space-y-2">
      <PlotFigure
        title={`Spectrum and fit, ${component}, interval from ${interval.startsAt.slice(11, 16)} UTC`}
        xLabel="Frequency (Hz)"
        yLabel={`PSD (${unit})`}
        height={300}
        caption={`Measured spectrum (grey), Lorentzian fit over its band (violet), fitted mode frequencies (dashed)${fit?.excluded?.length ? ', bins left out of the fit (shaded)' : ''}. ${spectrum.segments} Welch segments.`}
        options={{
          y: { type: 'log' },
          marks: [
            Plot.line(pts, { x: 'f', y: 'p', stroke: 'var(--c-muted, grey)' }),
            Plot.line(model, { x: 'f', y: 'p', stroke: 'var(--c-accent)', strokeWidth: 2 }),
            ...(fit
              ? [
                  Plot.ruleX(
                    fit.modes.map((m) => m.frequency),
                    { strokeDasharray: '3,3', strokeOpacity: 0.6 },
                  ),
                ]
              : []),
            // each left-out run of bins shaded out to half a bin on either side
            ...(fit?.excluded?.length
              ? [
                  Plot.rectX(fit.excluded, {
                    x1: (r: { minHz: number }) => r.minHz - halfBin,
                    x2: (r: { maxHz: number }) => r.maxHz + halfBin,
                    fill: 'var(--c-muted)',
                    fillOpacity: 0.15,
                  }),
                ]
              : []),
          ],
        }}
      />
      {fit ? <FitSettings fit={fit} /> : null}
      {fit ? (
        <DataTable
          caption="Fitted modes"
          rows={fit.modes.map((m, i) => ({
            id: i + 1,
            n: i + 1,
            f: m.frequency,
            df: m.errors.frequency,
            g: m.halfWidth,
            dg: m.errors.halfWidth,
            q: m.q,
            a: toDisplayPower(component, m.amplitude),
            da: toDisplayPower(component, m.errors.amplitude),
          }))}
          columns={[
            { key: 'n', header: 'Mode', numeric: true, digits: 0 },
            { key: 'f', header: 'Frequency', unit: 'Hz', numeric: true, digits: 3 },
            { key: 'df', header: '± frequency', unit: 'Hz', numeric: true, digits: 3 },
            { key: 'g', header: 'Half-width', unit: 'Hz', numeric: true, digits: 3 },
            { key: 'dg', header: '± half-width', unit: 'Hz', numeric: true, digits: 3 },
            { key: 'q', header: 'Q', numeric: true, digits: 2 },
            { key: 'a', header: 'Amplitude', unit, numeric: true, digits: 3 },
            { key: 'da', header: '± amplitude', unit, numeric: true, digits: 3 },
          ]}
        />
      ) : (
        <Notice tone="storm">No mode fit for this interval ({interval.qualityFlags.join(', ') || 'not fitted'}).</Notice>
      )}
    </div>
  );
}
