import { describe, expect, it } from 'vitest';
import type { Band } from '@/src/engine/band';
import { resolveCavity } from '@/src/engine/cavity/resolve';
import { predictSpectra } from '@/src/engine/forward/predict';
import { predictSpectraDirect } from '@/src/engine/forward/direct-spectra';
import { toDisplayUnits } from '@/src/engine/forward/units';
import type { ForwardStation } from '@/src/engine/forward/types';

const cavity = resolveCavity({ model: 'ishaq-jones', earthRadiusKm: 6371, heightKm: 60 });
const band: Band = { minHz: 5, maxHz: 40, stepHz: 0.25 };
const all = ['Ez', 'Bns', 'Bew'] as const;
const st = (code: string, lat: number, lon: number): ForwardStation => ({ code, lat, lon, components: all });

describe('spectra prediction', () => {
  it('reciprocity: swapping station and source leaves Ez unchanged (the kernel depends on distance only)', () => {
    const a = predictSpectra({ cavity, band, stations: [st('A', 35, -20)], sources: [{ lat: -12, lon: 95, intensity: 1e5 }] })[0];
    const b = predictSpectra({ cavity, band, stations: [st('B', -12, 95)], sources: [{ lat: 35, lon: -20, intensity: 1e5 }] })[0];
    a.power.forEach((p, j) => expect(Math.abs(p / b.power[j] - 1)).toBeLessThan(1e-12));
  });

  it('a source due north puts the magnetic field on the east–west coil only; due east, on the north–south coil only', () => {
    const [, bnsN, bewN] = predictSpectra({
      cavity,
      band,
      stations: [st('A', 10, 30)],
      sources: [{ lat: 50, lon: 30, intensity: 1e5 }],
    });
    const [, bnsE, bewE] = predictSpectra({
      cavity,
      band,
      stations: [st('A', 0, 30)],
      sources: [{ lat: 0, lon: 80, intensity: 1e5 }],
    });
    bnsN.power.forEach((p, j) => {
      expect(p).toBeLessThan(1e-25 * bewN.power[j]);
      expect(bewE.power[j]).toBeLessThan(1e-25 * bnsE.power[j]);
    });
  });

  it('incoherent sources: powers add, and scale linearly with intensity', () => {
    const stations = [st('A', 45, 5), st('B', -30, 140)];
    const s1 = { lat: 0, lon: 20, intensity: 3e4 };
    const s2 = { lat: 10, lon: -70, intensity: 5e4, spreadDeg: 6 };
    const both = predictSpectra({ cavity, band, stations, sources: [s1, s2] });
    const one = predictSpectra({ cavity, band, stations, sources: [s1] });
    const two = predictSpectra({ cavity, band, stations, sources: [{ ...s2, intensity: 1e5 }] });
    both.forEach((sp, i) =>
      sp.power.forEach((p, j) => expect(Math.abs(p / (one[i].power[j] + two[i].power[j] / 2) - 1)).toBeLessThan(1e-12)),
    );
  });

  it('agrees with a table-free evaluation to 1e-4 (points and spots, several stations)', () => {
    const stations = [st('A', 45, 5), { code: 'B', lat: -30, lon: 140, components: ['Bew', 'Ez'] as const }];
    const sources = [
      { lat: 0, lon: 20, intensity: 3e4 },
      { lat: 10, lon: -70, intensity: 5e4, spreadDeg: 6 },
    ];
    const smallBand = { minHz: 6, maxHz: 33, stepHz: 1.5 };
    const fast = predictSpectra({ cavity, band: smallBand, stations, sources });
    const slow = predictSpectraDirect({ cavity, band: smallBand, stations, sources });
    expect(fast.map((s) => `${s.station}.${s.component}`)).toEqual(['A.Ez', 'A.Bns', 'A.Bew', 'B.Bew', 'B.Ez']);
    fast.forEach((s, i) => s.power.forEach((p, j) => expect(Math.abs(p / slow[i].power[j] - 1)).toBeLessThan(1e-4)));
  });

  it('a spot of spread 0 is its centre point', () => {
    const stations = [st('A', 45, 5)];
    const p = predictSpectra({ cavity, band, stations, sources: [{ lat: 3, lon: 25, intensity: 1e4 }] });
    const q = predictSpectra({ cavity, band, stations, sources: [{ lat: 3, lon: 25, intensity: 1e4, spreadDeg: 0 }] });
    expect(q).toEqual(p);
  });

  it('display units: (mV/m)^2/Hz = 1e6 (V/m)^2/Hz, pT^2/Hz = 1e24 T^2/Hz (SI prefixes)', () => {
    const [ez, bns] = predictSpectra({
      cavity,
      band,
      stations: [st('A', 45, 5)],
      sources: [{ lat: 3, lon: 25, intensity: 1e5 }],
    });
    expect(toDisplayUnits(ez).power[4]).toBeCloseTo(ez.power[4] * 1e6, 20);
    expect(toDisplayUnits(ez).unit).toBe('(mV/m)^2/Hz');
    expect(toDisplayUnits(bns).power[4] / (bns.power[4] * 1e24)).toBeCloseTo(1, 14);
  });

  it('magnitudes are of the observed order for a whole-Earth background of 1e5 C^2 km^2/s (Heckman, Williams & Boldi 1998; from memory: Ez ~ 0.01–10 (mV/m)^2/Hz, B ~ 0.01–10 pT^2/Hz near 8 Hz)', () => {
    const [ez, , bew] = predictSpectra({
      cavity,
      band: { minHz: 8, maxHz: 8, stepHz: 1 },
      stations: [st('A', 45, 5)],
      sources: [{ lat: 0, lon: 60, intensity: 1e5 }],
    });
    const e = toDisplayUnits(ez).power[0];
    const b = toDisplayUnits(bew).power[0];
    expect(e).toBeGreaterThan(0.01);
    expect(e).toBeLessThan(10);
    expect(b).toBeGreaterThan(0.01);
    expect(b).toBeLessThan(10);
  });
});
