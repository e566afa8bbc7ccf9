/**
 * Regions with a fixed footprint (grid cells): the inverter's prediction for a
 * cell region equals the forward model of one point source per cell centre
 * carrying the cell's share of the intensity by area (the same sum the forward
 * command makes), so noise-free data from such sources are fitted exactly —
 * chi-square 0 at the truth in least squares on exact data (Press et al.,
 * Numerical Recipes §15.5). A round spot of the same area would not do: a belt
 * six cells long is nothing like a disc.
 */
import { describe, expect, it } from 'vitest';
import { invertSpectra } from '@/src/engine/inverse/invert';
import { prepareSpectrum } from '@/src/engine/inverse/interval-problem';
import { syntheticObserved } from '@/src/engine/inverse/synthetic';
import type { RegionUnknown } from '@/src/engine/inverse/types';
import { cellRegion } from '@/src/engine/sources/cell-region';
import { makeGlobalGrid, regionSources } from '@/src/engine/sources/grid';
import { centralDifferenceJacobian, maxColumnRelativeError } from './helpers';

const cavity = { model: 'linear' as const, earthRadiusKm: 6371, heightKm: 60 };
const freqs = Float64Array.from({ length: 49 }, (_, i) => 6 + 0.5 * i);
// Invented sites for a check, not real stations.
const stations = [
  { code: 'FP1', lat: 47, lon: 8 },
  { code: 'FP2', lat: -25, lon: 133 },
  { code: 'FP3', lat: 40, lon: -105 },
  { code: 'FP4', lat: 64, lon: -150 },
];
const belt = [300, 301, 302, 303, 304, 305]; // 10-degree cells 10 S-0, 55 W-5 W: a belt 60 degrees long
const BELT_I = 2.5e4;
const moving = { lat: 5, lon: 105, intensity: 1.2e4 };
// Noise-free data with a nominal sigma of ln(power) of 0.05.
const observed = syntheticObserved(
  cavity,
  stations,
  [...regionSources(makeGlobalGrid(10), belt, BELT_I), moving],
  freqs,
  0,
  1,
).map((o) => ({ ...o, sigmaLog: 0.05 }));
const region = cellRegion(10, belt);
const unknowns: RegionUnknown[] = [
  { name: 'Belt', intensity: { min: 1e2, max: 1e6 }, lat: region.lat, lon: region.lon, footprint: region.nodes },
  { name: 'Spot', intensity: { min: 1e2, max: 1e6 }, lat: { min: -20, max: 25 }, lon: { min: 80, max: 130 } },
];

describe('regions with a fixed footprint', () => {
  it('fits noise-free data from per-cell sources exactly and recovers both intensities and the moving centre', async () => {
    const res = await invertSpectra({ cavity, stations, observed, unknowns }, { starts: 8, seed: 3, threads: 1 });
    const best = res.minima[0];
    expect(best.misfit).toBeLessThan(1e-8);
    const s = Object.fromEntries(best.sources.map((x) => [x.name, x]));
    expect(s.Belt.intensity / BELT_I).toBeCloseTo(1, 6);
    expect(s.Spot.intensity / moving.intensity).toBeCloseTo(1, 6);
    expect(s.Spot.lat).toBeCloseTo(moving.lat, 4);
    expect(s.Spot.lon).toBeCloseTo(moving.lon, 4);
    expect(best.correlation.names).toEqual(['Belt.intensity', 'Spot.intensity', 'Spot.lat', 'Spot.lon']);
  });

  it('an equal-area round spot in its place misfits the same data badly', () => {
    const spot = { ...unknowns[0], footprint: undefined, spread: Math.acos(1 - region.areaSr / (2 * Math.PI)) / (Math.PI / 180) };
    const truth = Float64Array.from([Math.log(BELT_I), Math.log(moving.intensity), moving.lat, moving.lon]);
    const chi2 = (u: RegionUnknown[]) => {
      const { problem } = prepareSpectrum({ cavity, stations, observed, unknowns: u });
      const r = new Float64Array(problem.nResiduals);
      problem.residuals(truth, r);
      return r.reduce((a, x) => a + x * x, 0);
    };
    expect(chi2(unknowns)).toBeLessThan(1e-8);
    expect(chi2([spot, unknowns[1]])).toBeGreaterThan(1e3);
  });

  it('keeps the analytic Jacobian right when fixed regions are sampled once and a moving one changes', () => {
    const { problem } = prepareSpectrum({ cavity, stations, observed, unknowns });
    const p = Float64Array.from([Math.log(2e4), Math.log(1e4), 2, 110]);
    const J = new Float64Array(problem.nResiduals * problem.nParams);
    for (const q of [p, Float64Array.from([Math.log(3e4), Math.log(1.5e4), -7, 95])]) {
      problem.jacobian(q, J);
      expect(maxColumnRelativeError(J, centralDifferenceJacobian(problem, q), problem.nResiduals, problem.nParams)).toBeLessThan(
        1e-5,
      );
    }
  });

  it('refuses a footprint that could move, has a spread, or whose weights do not add up to 1', () => {
    const base = unknowns[0];
    const prep = (u: RegionUnknown) => () => prepareSpectrum({ cavity, stations, observed, unknowns: [u] });
    expect(prep({ ...base, lat: { min: -10, max: 0 } })).toThrow(
      'unknowns[0] (Belt): a region with a fixed footprint cannot move (lat and lon must be numbers)',
    );
    expect(prep({ ...base, spread: 3 })).toThrow('a region with a fixed footprint has no spread');
    expect(prep({ ...base, footprint: base.footprint!.map((q) => ({ ...q, weight: 0.5 })) })).toThrow(
      'unknowns[0] (Belt).footprint weights add up to 3, not 1',
    );
  });
});

describe('case files with regions given by grid cells', () => {
  it('pass the cells through to the inverter as a fixed footprint', async () => {
    const { invertCaseSchema } = await import('@/src/engine/case');
    const { inputFromCase } = await import('@/src/engine/case/spectrum-input');
    const c = invertCaseSchema.parse({
      cavity,
      band: { minHz: 6, maxHz: 30, stepHz: 0.5 },
      stations: stations.map((s) => ({ ...s, components: ['Ez', 'Bns', 'Bew'] })),
      observed: observed.map((o) => ({ ...o, frequencies: Array.from(o.frequencies), power: Array.from(o.power) })),
      unknowns: [
        { name: 'Belt', intensity: { min: 1e2, max: 1e6 }, cells: { cellSizeDeg: 10, ids: belt } },
        { name: 'Spot', intensity: { min: 1e2, max: 1e6 }, lat: { min: -20, max: 25 }, lon: { min: 80, max: 130 } },
      ],
    });
    const input = inputFromCase(c);
    expect(input.unknowns[0].footprint).toEqual(region.nodes);
    const res = await invertSpectra(input, { starts: 8, seed: 3, threads: 1 });
    expect(res.minima[0].misfit).toBeLessThan(1e-8);
    expect(res.minima[0].sources[0].intensity / BELT_I).toBeCloseTo(1, 6);
  });
});
