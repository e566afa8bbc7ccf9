import { describe, expect, it } from 'vitest';
import { resolveCavity } from '@/src/engine/cavity/resolve';
import { nuFromSpeedAttenuation, speedAttenuationFromNu } from '@/src/engine/cavity/propagation';
import { ishaqJonesAttenuation, ishaqJonesSpeed } from '@/src/engine/cavity/ishaq-jones';
import { tableProblems } from '@/src/engine/cavity/table';
import { cavityConfigSchema } from '@/src/engine/cavity/schema';
import { SPEED_OF_LIGHT } from '@/src/engine/constants';

const base = { earthRadiusKm: 6371, heightKm: 60 };

describe('propagation-parameter models', () => {
  it('linear model: Re nu = n at f = 6n + 2 Hz, Im nu < 0 (Nickolaenko & Hayakawa 2002, from memory)', () => {
    const cav = resolveCavity({ model: 'linear', ...base });
    for (let n = 1; n <= 6; n++) {
      const nu = cav.nu(6 * n + 2);
      expect(nu.re).toBeCloseTo(n, 12);
      expect(nu.im).toBeLessThan(0);
    }
  });

  it('Ishaq–Jones at 8 Hz: c/V ≈ 1.35, alpha ≈ 0.24 dB/Mm, nu ≈ 1.026 - 0.165i (Ishaq & Jones 1977, from memory; approximate)', () => {
    expect(ishaqJonesSpeed(8)).toBeCloseTo(1.35, 2);
    expect(ishaqJonesAttenuation(8)).toBeCloseTo(0.24, 2);
    const nu = resolveCavity({ model: 'ishaq-jones', ...base }).nu(8);
    expect(Math.abs(nu.re - 1.026)).toBeLessThan(0.01);
    expect(Math.abs(nu.im + 0.165)).toBeLessThan(0.01);
  });

  it('ideal lossless cavity resonates where nu(nu+1) = n(n+1): f_n = 10.6, 18.3, 25.9, 33.5 Hz for a = 6371 km (Schumann 1952)', () => {
    const a = 6371e3;
    const published = [10.6, 18.3, 25.9, 33.5];
    for (let n = 1; n <= 4; n++) {
      const fn = (SPEED_OF_LIGHT / (2 * Math.PI * a)) * Math.sqrt(n * (n + 1));
      expect(fn).toBeCloseTo(published[n - 1], 1);
      const nu = nuFromSpeedAttenuation(fn, a, 1, 0); // S = 1: no slowing, no loss
      expect(nu.re).toBeCloseTo(n, 10);
      expect(nu.im).toBeCloseTo(0, 12);
    }
  });

  it('nu(nu+1) = (k a S)^2 round trip (Nickolaenko, Galuk & Hayakawa 2016)', () => {
    for (const f of [3, 8, 21.5, 44]) {
      const nu = nuFromSpeedAttenuation(f, 6371e3, 1.27, 0.37);
      const back = speedAttenuationFromNu(f, 6371e3, nu);
      expect(back.cOverV).toBeCloseTo(1.27, 12);
      expect(back.alphaDbPerMm).toBeCloseTo(0.37, 12);
    }
  });

  it('describe() names the model and its parameters; the key separates different cavities', () => {
    const a = resolveCavity({ model: 'linear', ...base });
    const b = resolveCavity({ model: 'linear', earthRadiusKm: 6371, heightKm: 70 });
    const c = resolveCavity({ model: 'ishaq-jones', ...base });
    expect(a.describe().name).toBe('linear');
    expect(c.describe().parameters.heightKm).toBe(60);
    expect(new Set([a.key, b.key, c.key]).size).toBe(3);
    expect(resolveCavity({ model: 'linear', ...base }).key).toBe(a.key);
  });
});

describe('user propagation tables', () => {
  const rows: [number, number, number][] = [
    [2, 1.5, 0.1],
    [10, 1.3, 0.3],
    [50, 1.2, 0.8],
  ];

  it('interpolates c/V and attenuation linearly and reproduces the rows at their frequencies', () => {
    const cav = resolveCavity({ model: 'table', ...base, table: { columns: 'speed-attenuation', rows } });
    const at10 = cav.nu(10);
    const want = nuFromSpeedAttenuation(10, 6371e3, 1.3, 0.3);
    expect(at10.re).toBeCloseTo(want.re, 13);
    expect(at10.im).toBeCloseTo(want.im, 13);
    const mid = cav.nu(30); // halfway 10 -> 50 Hz
    const wantMid = nuFromSpeedAttenuation(30, 6371e3, 1.25, 0.55);
    expect(mid.re).toBeCloseTo(wantMid.re, 13);
    expect(() => cav.nu(60)).toThrow(/outside the propagation table/);
  });

  it('accepts Re/Im nu columns', () => {
    const cav = resolveCavity({
      model: 'table',
      ...base,
      table: {
        columns: 'nu',
        rows: [
          [4, 0.3, -0.05],
          [8, 1, -0.15],
        ],
      },
    });
    const nu = cav.nu(6);
    expect(nu.re).toBeCloseTo(0.65, 14);
    expect(nu.im).toBeCloseTo(-0.1, 14);
  });

  it('names the row at fault: frequencies strictly increasing, c/V > 0, attenuation >= 0, Im nu < 0', () => {
    const bad = tableProblems({
      columns: 'speed-attenuation',
      rows: [
        [2, 1.5, 0.1],
        [2, 1.3, 0.3],
        [5, -1, 0.2],
        [6, 1.1, -0.5],
      ],
    });
    expect(bad.map((p) => p.path.join('.'))).toEqual(['rows.1.0', 'rows.2.1', 'rows.3.2']);
    expect(bad[0].message).toMatch(/row 1.*strictly increasing/);
    const nuBad = tableProblems({
      columns: 'nu',
      rows: [
        [2, 0.1, -0.1],
        [3, 0.2, 0.1],
      ],
    });
    expect(nuBad[0].message).toMatch(/row 1: Im nu must be below 0/);
    const parsed = cavityConfigSchema.safeParse({
      model: 'table',
      ...base,
      table: {
        columns: 'speed-attenuation',
        rows: [
          [2, 1.5, 0.1],
          [1, 1.3, 0.3],
        ],
      },
    });
    expect(parsed.success).toBe(false);
    expect(parsed.error?.issues[0].path).toEqual(['table', 'rows', 1, 0]);
    expect(() => resolveCavity({ model: 'table', ...base })).toThrow(/cavity.table is required/);
  });
});
