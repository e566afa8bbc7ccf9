'use client';
/**
 * Figures of a cavity model, computed in the browser with the engine's own
 * functions: Re and Im of the propagation parameter nu(f), the phase-velocity
 * ratio c/V and the attenuation (dB/Mm) from nu (Nickolaenko, Galuk & Hayakawa
 * 2016 relations), and the predicted spectra of a test source at a chosen distance.
 */
import { useMemo, useState } from 'react';
import * as Plot from '@observablehq/plot';
import { PlotFigure } from '@/src/web/charts/PlotFigure';
import { Notice, inputClass } from '@/src/web/ui';
import { resolveCavity } from '@/src/engine/cavity/resolve';
import { speedAttenuationFromNu } from '@/src/engine/cavity/propagation';
import type { CavityConfig } from '@/src/engine/cavity/types';
import { predictSpectra } from '@/src/engine/forward/predict';
import { REGION_COLOURS } from '@/src/design/tokens';

export function ModelCurves({ config }: { config: CavityConfig }) {
  const [distanceMm, setDistanceMm] = useState(10);
  const [intensity, setIntensity] = useState(1e5);
  const curves = useMemo(() => {
    try {
      const cavity = resolveCavity(config);
      const lo = Math.max(4, cavity.validHz[0]);
      const hi = Math.min(45, cavity.validHz[1]);
      const pts = [];
      for (let f = lo; f <= hi + 1e-9; f += 0.25) {
        const nu = cavity.nu(f);
        const sa = speedAttenuationFromNu(f, cavity.radiusM, nu);
        pts.push({ f, re: nu.re, im: nu.im, cv: sa.cOverV, alpha: sa.alphaDbPerMm });
      }
      return { pts, lo, hi, error: null as string | null };
    } catch (e) {
      return { pts: [], lo: 4, hi: 45, error: (e as Error).message };
    }
  }, [config]);
  const spectra = useMemo(() => {
    if (curves.error) return null;
    const lonDeg = ((distanceMm * 1000) / config.earthRadiusKm) * (180 / Math.PI);
    if (!(lonDeg > 0 && lonDeg < 180))
      return { error: `The distance must lie between 0 and ${((Math.PI * config.earthRadiusKm) / 1000).toFixed(1)} Mm.` };
    try {
      const out = predictSpectra({
        cavity: config,
        band: { minHz: curves.lo, maxHz: curves.hi, stepHz: 0.25 },
        stations: [{ code: 'TEST', lat: 0, lon: 0, components: ['Ez', 'Bns'] }],
        sources: [{ lat: 0, lon: lonDeg, intensity }],
      });
      return { ez: out[0], b: out[1], error: null };
    } catch (e) {
      return { error: (e as Error).message };
    }
  }, [config, curves, distanceMm, intensity]);
  if (curves.error)
    return (
      <Notice tone="error" title="This model cannot be evaluated">
        {curves.error}
      </Notice>
    );
  const line = (y: string, stroke: string = REGION_COLOURS[0]) =>
    ({ marks: [Plot.line(curves.pts, { x: 'f', y, stroke }), Plot.ruleY([0], { strokeOpacity: 0.3 })] }) as Plot.PlotOptions;
  return (
    <div className="space-y-6">
      <div className="grid gap-6 lg:grid-cols-2">
        <PlotFigure
          title="Real part of ν"
          xLabel="Frequency (Hz)"
          yLabel="Re ν (dimensionless)"
          options={line('re')}
          height={220}
        />
        <PlotFigure
          title="Imaginary part of ν"
          xLabel="Frequency (Hz)"
          yLabel="Im ν (dimensionless)"
          options={line('im', REGION_COLOURS[1])}
          height={220}
        />
        <PlotFigure
          title="Phase-velocity ratio"
          xLabel="Frequency (Hz)"
          yLabel="c/V (dimensionless)"
          options={line('cv', REGION_COLOURS[2])}
          height={220}
        />
        <PlotFigure
          title="Attenuation"
          xLabel="Frequency (Hz)"
          yLabel="α (dB/Mm)"
          options={line('alpha', REGION_COLOURS[4])}
          height={220}
        />
      </div>
      <div className="space-y-3">
        <div className="flex flex-wrap gap-4">
          <label className="block text-sm font-medium">
            Test source distance (Mm)
            <input
              type="number"
              step="0.5"
              min="0.5"
              max="19.5"
              className={inputClass}
              value={distanceMm}
              onChange={(e) => setDistanceMm(Number(e.target.value))}
            />
          </label>
          <label className="block text-sm font-medium">
            Intensity (C² km²/s)
            <input
              type="number"
              step="any"
              className={inputClass}
              value={intensity}
              onChange={(e) => setIntensity(Number(e.target.value))}
            />
          </label>
        </div>
        {spectra?.error ? <Notice tone="error">{spectra.error}</Notice> : null}
        {spectra && 'ez' in spectra && spectra.ez && spectra.b ? (
          <div className="grid gap-6 lg:grid-cols-2">
            <PlotFigure
              title={`Ez of a source ${distanceMm} Mm away`}
              xLabel="Frequency (Hz)"
              yLabel="Power ((mV/m)²/Hz)"
              options={
                {
                  y: { type: 'log' },
                  marks: [
                    Plot.line(
                      spectra.ez.frequencies.map((f, i) => ({ f, p: spectra.ez!.power[i] * 1e6 })),
                      { x: 'f', y: 'p', stroke: REGION_COLOURS[0] },
                    ),
                  ],
                } as Plot.PlotOptions
              }
              height={240}
            />
            <PlotFigure
              title="Horizontal magnetic field (coil across the path)"
              xLabel="Frequency (Hz)"
              yLabel="Power (pT²/Hz)"
              options={
                {
                  y: { type: 'log' },
                  marks: [
                    Plot.line(
                      spectra.b.frequencies.map((f, i) => ({ f, p: spectra.b!.power[i] * 1e24 })),
                      { x: 'f', y: 'p', stroke: REGION_COLOURS[1] },
                    ),
                  ],
                } as Plot.PlotOptions
              }
              height={240}
            />
          </div>
        ) : null}
      </div>
    </div>
  );
}
