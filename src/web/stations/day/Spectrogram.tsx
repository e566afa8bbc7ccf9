'use client';
/** Interval × frequency picture of one day: colour is log10 of the power spectral density. */
import { useMemo } from 'react';
import * as Plot from '@observablehq/plot';
import { PlotFigure } from '@/src/web/charts/PlotFigure';
import { RAMPS } from '@/src/design/tokens';
import { dayAxis, displayUnit, toDisplayPower, type Spectrum } from './types';

const SLOT_MS = 600_000;
const SLOTS = 144; // ten-minute intervals in a day

export function Spectrogram({
  spectra,
  component,
  day,
  dayStart,
  loading,
}: {
  spectra: Spectrum[];
  component: string;
  day: string;
  dayStart: number;
  loading: boolean;
}) {
  const raster = useMemo(() => {
    if (!spectra.length) return null;
    const freqs = spectra[0].frequencies;
    const ny = freqs.length;
    const values = new Float64Array(SLOTS * ny).fill(NaN);
    for (const s of spectra) {
      const col = Math.floor((Date.parse(s.startsAt) - dayStart) / SLOT_MS);
      if (col < 0 || col >= SLOTS) continue;
      for (let j = 0; j < ny && j < s.power.length; j++) {
        const p = toDisplayPower(component, s.power[j]);
        values[(ny - 1 - j) * SLOTS + col] = p > 0 ? Math.log10(p) : NaN;
      }
    }
    return { values, ny, fMin: freqs[0], fMax: freqs[ny - 1] };
  }, [spectra, dayStart, component]);

  if (!raster) return <p className="text-sm text-muted">{loading ? 'Loading spectra…' : 'No spectra on this day.'}</p>;
  const unit = displayUnit(component);
  return (
    <PlotFigure
      title={`Spectrogram, ${component}, ${day}`}
      xLabel="Interval start (UTC)"
      yLabel="Frequency (Hz)"
      height={300}
      caption={`Colour: log10 of power spectral density in ${unit}; gaps are intervals without data.`}
      options={{
        marginBottom: 40,
        x: dayAxis(dayStart),
        y: { domain: [raster.fMin, raster.fMax] },
        color: { type: 'linear', interpolate: RAMPS.depth, legend: true, label: `log10 PSD (${unit})` },
        marks: [
          Plot.raster(raster.values, {
            width: SLOTS,
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
  );
}
