/**
 * The inverter's internal prediction (effective kernels of point and spot
 * regions from kernel tables) against the engine's table-free reference
 * forward model (predictSpectraDirect: Legendre functions evaluated directly),
 * to the kernel tables' 1e-4 relative accuracy.
 */
import { describe, expect, it } from 'vitest';
import { bandFrequencies } from '@/src/engine/band';
import type { Component } from '@/src/engine/components';
import { predictSpectraDirect } from '@/src/engine/forward/direct-spectra';
import { prepareSpectrum } from '@/src/engine/inverse/interval-problem';
import { LINEAR_CAVITY } from './helpers';

describe('inverter prediction', () => {
  it('agrees with the table-free forward model for a point and a spot region', () => {
    const band = { minHz: 6, maxHz: 30, stepHz: 2 };
    const freqs = Array.from(bandFrequencies(band));
    const comps: Component[] = ['Ez', 'Bns', 'Bew'];
    const stations = [
      { code: 'FA1', lat: 41, lon: -12, components: comps },
      { code: 'FA2', lat: -18, lon: 95, components: comps },
    ];
    const sources = [
      { name: 'R1', lat: 4, lon: 21, intensity: 3.5e4 },
      { name: 'R2', lat: -6, lon: -55, intensity: 2e4, spreadDeg: 6 },
    ];
    const ref = predictSpectraDirect({ cavity: LINEAR_CAVITY, band, stations, sources });
    const { problem } = prepareSpectrum({
      cavity: LINEAR_CAVITY,
      stations,
      observed: ref.map((s) => ({ station: s.station, component: s.component, frequencies: freqs, power: s.power, sigmaLog: 1 })),
      unknowns: [
        { name: 'R1', intensity: { min: 1, max: 1e6 }, lat: { min: -10, max: 10 }, lon: { min: 0, max: 40 } },
        {
          name: 'R2',
          intensity: { min: 1, max: 1e6 },
          lat: { min: -10, max: 10 },
          lon: { min: -80, max: -30 },
          spread: { min: 0, max: 10 },
        },
      ],
    });
    const x = Float64Array.from([Math.log(3.5e4), 4, 21, Math.log(2e4), -6, -55, 6]);
    const r = new Float64Array(problem.nResiduals);
    problem.residuals(x, r);
    // residual = ln P_inverter - ln P_reference (sigma 1)
    for (const v of r) expect(Math.abs(v)).toBeLessThan(1e-4);
  });
});
