import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { parseHTML } from 'linkedom';
import { bandFrequencies } from '@/src/engine/band';
import { invertSpectra } from '@/src/engine/inverse/invert';
import { closeInversionPool } from '@/src/engine/inverse/threads/pool';
import { syntheticObserved } from '@/src/engine/inverse/synthetic';
import type { InversionResult } from '@/src/engine/inverse/types';
import type { RunView } from '@/src/runs/results';
import type { RunFits } from '@/src/runs/fits';
import { firstFigures } from '@/src/web/runs/figures/prerender';
import { seriesFigure } from '@/src/web/runs/figures/series';
import { correlationFigure } from '@/src/web/runs/figures/correlation';
import { startsFigure } from '@/src/web/runs/figures/starts';
import { fitFigures } from '@/src/web/runs/figures/fits';
import { beltRegion } from './belt-region';

// An invented two-station world with one source region; the result is the engine's own inversion of it.
const cavity = { model: 'linear' as const, earthRadiusKm: 6371, heightKm: 60 };
const freqs = bandFrequencies({ minHz: 6, maxHz: 30, stepHz: 0.5 });
const stations = [
  { code: 'PA1', lat: 40, lon: 10 },
  { code: 'PA2', lat: -30, lon: 140 },
];
const observed = syntheticObserved(cavity, stations, [{ lat: 0, lon: 20, intensity: 3e4 }], freqs, 0.1, 7);
let result: InversionResult;

beforeAll(async () => {
  result = await invertSpectra(
    {
      cavity,
      stations,
      observed,
      unknowns: [{ name: 'Belt', intensity: { min: 1e2, max: 1e6 }, lat: { min: -20, max: 20 }, lon: { min: 0, max: 40 } }],
    },
    { starts: 4, seed: 3, threads: 1 },
  );
});
afterAll(() => closeInversionPool());

function view(intervals: number): RunView {
  return {
    grid: {
      id: 'g',
      name: 'Grid',
      version: 1,
      cellSizeDeg: 10,
      regions: [beltRegion('#eb476b', 0)],
    },
    intervals: Array.from({ length: intervals }, (_, i) => ({
      startsAt: new Date(Date.UTC(2031, 6, 2) + i * 600_000).toISOString(),
      nData: result.nData,
      seconds: 0.1,
      result,
    })),
  } as unknown as RunView;
}

const fits: RunFits = {
  series: observed.map((o) => ({
    station: o.station,
    component: o.component,
    frequencies: Array.from(o.frequencies),
    observed: Array.from(o.power),
    predicted: Array.from(o.power, (p) => p * 1.05),
    residual: Array.from(o.power, () => 0.5),
    chi2PerBin: 0.25,
  })),
  stations: [],
};

const label = (markup: string | null) =>
  markup
    ? parseHTML(`<html><body>${markup}</body></html>`).document.querySelector('svg[aria-label]')?.getAttribute('aria-label')
    : null;

describe('firstFigures', () => {
  it('draws every figure of the first view under the title the browser draws it with', () => {
    const v = view(3);
    const f = firstFigures(v, fits);
    expect(label(f.series)).toBe(seriesFigure(v.intervals, { Belt: '#eb476b' }).title);
    expect(label(f.correlation)).toBe(correlationFigure(result.minima[0]).title);
    expect(label(f.starts)).toBe(startsFigure(result, 0).title);
    expect(label(f.power)).toBe(fitFigures(fits.series[0]).power.title);
    expect(label(f.residual)).toBe(fitFigures(fits.series[0]).residual.title);
  });

  it('draws one point per interval and region on the daily curves, and one per bin on the fitted spectrum', () => {
    const f = firstFigures(view(3), fits);
    const doc = (m: string | null) => parseHTML(`<html><body>${m}</body></html>`).document;
    expect(doc(f.series).querySelectorAll('circle').length).toBe(3);
    expect(doc(f.power).querySelectorAll('circle').length).toBe(freqs.length);
  });

  it('leaves out the daily curves for one interval, and the fitted spectra without fits', () => {
    const f = firstFigures(view(1), null);
    expect(f.series).toBeNull();
    expect(f.power).toBeNull();
    expect(f.residual).toBeNull();
    expect(f.correlation).not.toBeNull();
  });

  it('draws nothing for a run with no solved interval', () => {
    const v = { ...view(2), intervals: view(2).intervals.map((i) => ({ ...i, result: null })) } as RunView;
    expect(firstFigures(v, null)).toEqual({ series: null, correlation: null, starts: null, power: null, residual: null });
  });
});
