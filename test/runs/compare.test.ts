/**
 * Side-by-side rows of two runs: settings that differ are marked, and each
 * parameter's difference is judged against the combined one-sigma error of
 * two independent estimates, sqrt(sa^2 + sb^2) (common practice, e.g. Taylor,
 * An Introduction to Error Analysis, 1997, ch. 3). Values chosen as 3-4-5
 * triangles so the expected combined errors are exact by hand.
 */
import { describe, expect, it } from 'vitest';
import { agreementOf, comparisonColours, parameterComparison, settingsDiff, sharedLogRange } from '@/src/runs/compare';
import { REGION_COLOURS } from '@/src/design/tokens';
import type { Region } from '@/src/runs/grid-spec';
import type { Minimum } from '@/src/engine/inverse/types';
import type { RunView } from '@/src/runs/results';

function minimum(
  sources: { name: string; lat: number; lon: number; intensity: number }[],
  errors: Minimum['stdErrors'],
): Minimum {
  return { sources, stdErrors: errors } as unknown as Minimum;
}

describe('parameterComparison', () => {
  const a = minimum([{ name: 'East basin', lat: -3, lon: 22, intensity: 3e4 }], {
    'East basin': { intensity: 3e3, lat: 0.3, lon: 0.6 },
  });
  const b = minimum(
    [
      { name: 'East basin', lat: -2, lon: 25, intensity: 3.5e4 },
      { name: 'West shelf', lat: 10, lon: -20, intensity: 800 },
    ],
    { 'East basin': { intensity: 4e3, lat: 0.4, lon: 0.8 }, 'West shelf': { intensity: 100 } },
  );
  const rows = parameterComparison(a, b);

  it('differences, combined errors and agreement by hand', () => {
    const by = Object.fromEntries(rows.map((r) => [r.name, r]));
    expect(by['East basin.intensity']).toMatchObject({ difference: 5e3, agreement: 'agree' });
    expect(by['East basin.intensity'].combinedError).toBeCloseTo(5e3, 9);
    expect(by['East basin.intensity'].z).toBeCloseTo(1, 12);
    expect(by['East basin.lat'].combinedError).toBeCloseTo(0.5, 12);
    expect(by['East basin.lat']).toMatchObject({ difference: 1, agreement: 'within 2σ' });
    expect(by['East basin.lon'].z).toBeCloseTo(3, 12);
    expect(by['East basin.lon'].agreement).toBe('differ');
  });

  it('a region only one minimum has is listed without a difference; fixed positions are not parameters', () => {
    expect(rows.map((r) => r.name)).toEqual(['East basin.intensity', 'East basin.lat', 'East basin.lon', 'West shelf.intensity']);
    expect(rows[3]).toMatchObject({ a: null, b: 800, difference: null, agreement: null });
  });

  it('no stated error means no verdict', () => {
    expect(agreementOf(1, null)).toEqual({ z: null, agreement: 'no error' });
    expect(agreementOf(1, 0)).toEqual({ z: null, agreement: 'no error' });
  });
});

describe('settingsDiff', () => {
  const view = (starts: number, model: string) =>
    ({
      run: { engineVersion: 'e1' },
      config: {
        data: {
          stationIds: ['s2', 's1'],
          components: ['Ez'],
          from: '2031-05-12T06:00:00Z',
          to: '2031-05-12T07:00:00Z',
          includeFlagged: false,
        },
        observables: { kind: 'spectrum', minHz: 6, maxHz: 30, every: 1 },
        regions: [{ region: 'r', intensity: { min: 1, max: 10 } }],
        damping: { initialLambda: 0.01, maxIterations: 200, scaleCovariance: true },
        starts,
        seed: 1,
      },
      model: { name: model, version: 1, config: { model: 'linear', earthRadiusKm: 6371, heightKm: 60 } },
      grid: { name: 'G', version: 2, cellSizeDeg: 10, regions: [{ key: 'r', name: 'Region' }] },
    }) as unknown as RunView;

  it('marks exactly the settings that differ', () => {
    const rows = settingsDiff(view(16, 'Linear'), view(32, 'Other'), (id) => id.toUpperCase());
    expect(rows.filter((r) => r.differs).map((r) => r.label)).toEqual(['Cavity model', 'Starts / seed']);
    expect(rows.find((r) => r.label === 'Stations')!.a).toBe('S1, S2');
    expect(settingsDiff(view(16, 'L'), view(16, 'L')).some((r) => r.differs)).toBe(false);
  });
});

describe('comparisonColours', () => {
  const region = (name: string, colour: string) => ({ name, colour }) as unknown as Region;
  const [c0, c1, c2] = REGION_COLOURS;

  it('a region named in both picks gets one colour; other regions never share a colour', () => {
    // Both grids gave their first region the first colour: B's other region must not take A's.
    const out = comparisonColours(
      [region('East basin', c0), region('West shelf', c1)],
      [region('Ridge', c0), region('East basin', c2)],
    );
    expect(out['East basin']).toBe(c0);
    expect(out['West shelf']).toBe(c1);
    expect(out['Ridge']).toBe(c2);
    expect(new Set(Object.values(out)).size).toBe(3);
  });

  it('keeps a colour of B that A does not use', () => {
    expect(comparisonColours([region('A1', c0)], [region('B1', c1)])).toEqual({ A1: c0, B1: c1 });
  });
});

describe('sharedLogRange', () => {
  const m = (...I: number[]) => ({ sources: I.map((intensity, k) => ({ name: `r${k}`, intensity })) }) as unknown as Minimum;

  it('spans the log10 intensities of both minima', () => {
    expect(sharedLogRange([m(1e3, 1e4), m(1e5)])).toEqual({ lo: 3, hi: 5 });
  });

  it('one value gives a decade around it; no minimum gives none', () => {
    expect(sharedLogRange([m(1e4), null])).toEqual({ lo: 3.5, hi: 4.5 });
    expect(sharedLogRange([null, null])).toBeNull();
  });
});
