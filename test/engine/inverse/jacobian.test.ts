/**
 * The analytic Jacobian of the spectrum misfit against central finite
 * differences (Nocedal & Wright, Numerical Optimization, §8.1: the central
 * difference error is O(h^2)), to 1e-6 relative per column.
 */
import { describe, expect, it } from 'vitest';
import { buildDataLayout } from '@/src/engine/inverse/data-layout';
import { buildParameterisation } from '@/src/engine/inverse/parameters';
import { spectrumProblem } from '@/src/engine/inverse/spectrum-objective';
import type { ObservedSeries, StationSite } from '@/src/engine/inverse/types';
import type { Component } from '@/src/engine/components';
import { engineKernel } from '@/src/engine/inverse/kernel-sampler';
import { analyticKernel, centralDifferenceJacobian, LINEAR_CAVITY, maxColumnRelativeError } from './helpers';

const stations: StationSite[] = [
  { code: 'KVA', lat: 47.2, lon: 12.5 },
  { code: 'ORM', lat: -33.8, lon: 151.0 },
  { code: 'TAL', lat: 64.1, lon: -147.3 },
];
const freqs = Array.from({ length: 41 }, (_, i) => 5 + 0.5 * i);
const observed: ObservedSeries[] = stations.flatMap((s) =>
  (['Ez', 'Bns', 'Bew'] as Component[]).map((c, ci) => ({
    station: s.code,
    component: c,
    frequencies: freqs,
    power: freqs.map((f) => (c === 'Ez' ? 1e-12 : 1e-24) * (1 + 0.3 * Math.sin(f + ci))),
    sigmaLog: 0.1 + 0.05 * ci,
  })),
);
const unknowns = [
  { name: 'R1', intensity: { min: 10, max: 1e6 }, lat: { min: -30, max: 30 }, lon: { min: -100, max: -30 } },
  { name: 'R2', intensity: { min: 10, max: 1e6 }, lat: { min: -20, max: 20 }, lon: { min: 150, max: -160 } },
  { name: 'R3', intensity: 2e4, lat: { min: -20, max: 20 }, lon: 100 },
];

describe('spectrum misfit Jacobian', () => {
  const layout = buildDataLayout(stations, observed);
  const par = buildParameterisation(unknowns);
  const point = Float64Array.from([Math.log(3e4), -4, -62, Math.log(1e4), 8, 190, 5]);

  for (const scale of ['log', 'linear'] as const) {
    it(`matches central differences to 1e-6 relative (${scale} misfit, free intensities and centres, one fixed)`, () => {
      expect(par.names).toEqual(['R1.intensity', 'R1.lat', 'R1.lon', 'R2.intensity', 'R2.lat', 'R2.lon', 'R3.lat']);
      const prob = spectrumProblem(layout, analyticKernel(layout.freqs), par, scale);
      const analytic = new Float64Array(prob.nResiduals * prob.nParams);
      prob.jacobian(point, analytic);
      const numeric = centralDifferenceJacobian(prob, point);
      expect(maxColumnRelativeError(analytic, numeric, prob.nResiduals, prob.nParams)).toBeLessThan(1e-6);
    });
  }

  it('matches central differences with Welch statistics (whitened residuals and rows, a bin left out)', () => {
    const welch = { segments: 20, window: 'hann' as const, overlap: 0.5, effectiveAverages: 19.1 };
    const withGap = observed.map((o) => ({
      ...o,
      frequencies: freqs.filter((_, k) => k !== 7),
      power: Array.from(o.power).filter((_, k) => k !== 7),
      welch,
    }));
    const l = buildDataLayout(stations, withGap);
    expect(l.series[0].whiten).toBeDefined();
    const prob = spectrumProblem(l, analyticKernel(l.freqs), par, 'log');
    const analytic = new Float64Array(prob.nResiduals * prob.nParams);
    prob.jacobian(point, analytic);
    const numeric = centralDifferenceJacobian(prob, point);
    expect(maxColumnRelativeError(analytic, numeric, prob.nResiduals, prob.nParams)).toBeLessThan(1e-6);
  });

  it('matches central differences for spot regions (free spread, fixed spread) with the engine kernel', () => {
    const spotUnknowns = [
      {
        name: 'R1',
        intensity: { min: 10, max: 1e6 },
        lat: { min: -30, max: 30 },
        lon: { min: -100, max: -30 },
        spread: { min: 0.5, max: 10 },
      },
      { name: 'R2', intensity: { min: 10, max: 1e6 }, lat: { min: -20, max: 20 }, lon: { min: 150, max: -160 }, spread: 4 },
    ];
    const spar = buildParameterisation(spotUnknowns);
    expect(spar.names).toEqual(['R1.intensity', 'R1.lat', 'R1.lon', 'R1.spread', 'R2.intensity', 'R2.lat', 'R2.lon']);
    const prob = spectrumProblem(layout, engineKernel(LINEAR_CAVITY, layout.freqs), spar, 'log');
    const x = Float64Array.from([Math.log(3e4), -4, -62, 3.5, Math.log(1e4), 8, 190]);
    const analytic = new Float64Array(prob.nResiduals * prob.nParams);
    prob.jacobian(x, analytic);
    const numeric = centralDifferenceJacobian(prob, x);
    expect(maxColumnRelativeError(analytic, numeric, prob.nResiduals, prob.nParams)).toBeLessThan(1e-6);
  });
});
