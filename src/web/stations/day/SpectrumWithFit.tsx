'use client';
/** One interval's measured spectrum with its fitted mode model, how the fit was made and the fitted modes. */
import * as Plot from '@observablehq/plot';
import { PlotFigure } from '@/src/web/charts/PlotFigure';
import { DataTable, Notice } from '@/src/web/ui';
import { FitSettings } from '../FitSettings';
import { fittedCurve } from '../fit-curve';
import { displayUnit, toDisplayPower, type Interval, type Spectrum } from './types';

export function SpectrumWithFit({
  interval,
  spectrum,
  component,
}: {
  interval: Interval;
  spectrum: Spectrum;
  component: string;
}) {
  const unit = displayUnit(component);
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
