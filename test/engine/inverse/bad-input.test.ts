/** Every bad inversion input is refused with an InversionInputError naming the problem. */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { invertCaseSchema } from '@/src/engine/case';
import { inputFromCase } from '@/src/engine/case/spectrum-input';
import { buildDataLayout } from '@/src/engine/inverse/data-layout';
import { InversionInputError } from '@/src/engine/inverse/errors';
import { buildParameterisation } from '@/src/engine/inverse/parameters';
import { prepareSpectrum } from '@/src/engine/inverse/interval-problem';
import type { ObservedSeries } from '@/src/engine/inverse/types';
import { LINEAR_CAVITY } from './helpers';

const stations = [{ code: 'BA1', lat: 10, lon: 10 }];
const series = (over: Partial<ObservedSeries> = {}): ObservedSeries => ({
  station: 'BA1',
  component: 'Ez',
  frequencies: [8, 9, 10, 11],
  power: [1e-12, 2e-12, 1.5e-12, 1e-12],
  sigmaLog: 0.1,
  ...over,
});
const region = { name: 'R1', intensity: { min: 10, max: 1e5 }, lat: { min: -10, max: 10 }, lon: { min: 0, max: 40 } };

function expectInputError(f: () => unknown, pattern: RegExp) {
  expect(f).toThrow(InversionInputError);
  expect(f).toThrow(pattern);
}

describe('bad inversion input', () => {
  it('bounds with min above max name the region and quantity', () => {
    expectInputError(
      () => buildParameterisation([{ ...region, lat: { min: 5, max: -5 } }]),
      /unknowns\[0\] \(R1\)\.lat: min 5 is greater than max -5/,
    );
    expectInputError(() => buildParameterisation([{ ...region, intensity: { min: 0, max: 10 } }]), /intensity must be above 0/);
    expectInputError(() => buildParameterisation([region, region]), /"R1" is used twice/);
  });
  it('empty data, zero, negative or NaN power and bad sigma name the series and bin', () => {
    expectInputError(() => buildDataLayout(stations, []), /no spectra/);
    expectInputError(
      () => buildDataLayout(stations, [series({ power: [1e-12, 0, 1, 1] })]),
      /observed\[0\] \(BA1 Ez\): power at bin 1 \(9 Hz\)/,
    );
    expectInputError(() => buildDataLayout(stations, [series({ power: [1e-12, 1, -3, 1] })]), /power at bin 2/);
    expectInputError(() => buildDataLayout(stations, [series({ power: [NaN, 1, 1, 1] })]), /power at bin 0/);
    expectInputError(() => buildDataLayout(stations, [series({ sigmaLog: 0 })]), /sigmaLog must be a positive number/);
    expectInputError(() => buildDataLayout(stations, [series({ sigmaLog: -1 })]), /sigmaLog/);
  });
  it('missing, contradictory or too few Welch statistics name the series and the field', () => {
    const welch = { segments: 10, window: 'hann' as const, overlap: 0.5, effectiveAverages: 9.5 };
    expectInputError(
      () => buildDataLayout(stations, [series({ sigmaLog: undefined })]),
      /observed\[0\] \(BA1 Ez\): sigmaLog or welch/,
    );
    expectInputError(
      () => buildDataLayout(stations, [series({ welch: { ...welch, effectiveAverages: 11 } })]),
      /observed\[0\] \(BA1 Ez\): welch\.effectiveAverages: 11 exceeds the 10 segments/,
    );
    expectInputError(
      () => buildDataLayout(stations, [series({ welch: { ...welch, segments: 3, effectiveAverages: 2.9 } })]),
      /welch\.segments: at least 4/,
    );
    expectInputError(
      () => buildDataLayout(stations, [series({ welch: { ...welch, effectiveAverages: 0 } })]),
      /welch\.effectiveAverages: must be a positive/,
    );
    expectInputError(
      () => buildDataLayout(stations, [series({ welch, power: [1e-12, 0, 1, 1] })]),
      /observed\[0\] \(BA1 Ez\): power at bin 1/,
    );
    const parsed = invertCaseSchema.safeParse({
      cavity: { model: 'linear' },
      band: { minHz: 8, maxHz: 11, stepHz: 1 },
      stations: [{ code: 'BA1', lat: 10, lon: 10, components: ['Ez'] }],
      observed: [{ station: 'BA1', component: 'Ez', frequencies: [8, 9], power: [1, 1], welch: { ...welch, segments: 2 } }],
      unknowns: [region],
    });
    expect(parsed.success).toBe(false);
    expect(parsed.error!.issues[0].path).toEqual(['observed', 0, 'welch', 'segments']);
  });
  it('with Welch statistics sigma comes from K_eff and the log bias is removed (psi, psi1)', () => {
    const welch = { segments: 10, window: 'hann' as const, overlap: 0.5, effectiveAverages: 9.5 };
    const plain = buildDataLayout(stations, [series()]).series[0];
    const s = buildDataLayout(stations, [series({ welch })]).series[0];
    // psi(9.5) - ln 9.5 = -0.0535539 and psi1(9.5) = 0.1109973 (scipy.special.digamma, polygamma(1, .))
    expect(s.invSigma).toBeCloseTo(1 / Math.sqrt(0.1109973), 6);
    for (let k = 0; k < 4; k++) expect(s.lnObs[k] - plain.lnObs[k]).toBeCloseTo(0.0535539, 6);
  });
  it('unknown station and component names are named', () => {
    expectInputError(() => buildDataLayout(stations, [series({ station: 'ZZZ' })]), /unknown station "ZZZ"/);
    expectInputError(() => buildDataLayout(stations, [series({ component: 'Bz' as never })]), /unknown component "Bz"/);
  });
  it('excluding every bin, or more parameters than data, is refused', () => {
    expectInputError(
      () => buildDataLayout(stations, [series()], { exclude: [{ minHz: 7, maxHz: 12 }] }),
      /every bin is excluded/,
    );
    expectInputError(
      () =>
        prepareSpectrum({
          cavity: LINEAR_CAVITY,
          stations,
          observed: [series({ frequencies: [8, 9], power: [1e-12, 1e-12] })],
          unknowns: [region],
        }),
      /more free parameters \(3\) than data \(2\)/,
    );
  });
  it('mains bins are left out: with 50 Hz mains the 49.75–50.25 Hz bins do not count', () => {
    const f = [49, 49.75, 50, 50.25, 51];
    const layout = buildDataLayout(stations, [series({ frequencies: f, power: f.map(() => 1e-12) })], {
      mainsHz: 50,
      mainsHalfWidthHz: 0.3,
    });
    expect(Array.from(layout.freqs)).toEqual([49, 51]);
  });
});

describe('case selection field', () => {
  it('leaves the selected mains bins out, and names a bad selection', () => {
    const raw = JSON.parse(readFileSync('fixtures/cases/two-minima.json', 'utf8'));
    const input = inputFromCase(invertCaseSchema.parse({ ...raw, selection: { mainsHz: 10, mainsHalfWidthHz: 0.3 } }));
    const layout = buildDataLayout(input.stations, input.observed, input.selection);
    // 6..30 Hz at 0.5 Hz is 49 bins; 10, 20 and 30 Hz are mains harmonics
    expect(layout.freqs.length).toBe(46);
    expect(Array.from(layout.freqs)).not.toContain(20);
    expect(() => inputFromCase(invertCaseSchema.parse({ ...raw, selection: { exclude: [{ minHz: 9, maxHz: 8 }] } }))).toThrow(
      /selection\.exclude\.0\.maxHz/,
    );
  });
});
