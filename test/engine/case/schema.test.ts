import { describe, expect, it } from 'vitest';
import { caseSchema, forwardCaseSchema, invertCaseSchema } from '@/src/engine/case/schema';

const good = {
  cavity: { model: 'linear', earthRadiusKm: 6371, heightKm: 60 },
  band: { minHz: 5, maxHz: 40, stepHz: 0.25 },
  stations: [{ code: 'KVA', lat: 44.1, lon: -98.2, components: ['Ez', 'Bns', 'Bew'] }],
  sources: [{ name: 'R1', lat: -4.0, lon: -62.0, intensity: 30000 }],
  observed: [{ station: 'KVA', component: 'Ez', frequencies: [5, 5.25], power: [1.2e-8, 1.3e-8], sigmaLog: 0.05 }],
  unknowns: [{ name: 'R1', intensity: { min: 100, max: 1e6 }, lat: { min: -30, max: 20 }, lon: -62 }],
  comment: 'extra fields are kept',
};

const firstIssue = (data: unknown, schema = caseSchema) => {
  const r = schema.safeParse(data);
  expect(r.success).toBe(false);
  return { path: r.error!.issues[0].path.join('.'), message: r.error!.issues[0].message };
};

describe('case file schema', () => {
  it('accepts a complete case, keeps extra fields, and fixed positions as single numbers', () => {
    const r = caseSchema.parse(good);
    expect((r as Record<string, unknown>).comment).toBe('extra fields are kept');
    expect(r.unknowns?.[0].lon).toBe(-62);
    expect(forwardCaseSchema.safeParse(good).success).toBe(true);
    expect(invertCaseSchema.safeParse(good).success).toBe(true);
  });

  it('names the field at fault', () => {
    expect(firstIssue({ ...good, stations: [{ ...good.stations[0], lat: 95 }] }).path).toBe('stations.0.lat');
    expect(firstIssue({ ...good, cavity: { ...good.cavity, model: 'flat' } }).path).toBe('cavity.model');
    expect(firstIssue({ ...good, band: { minHz: 10, maxHz: 5, stepHz: 1 } }).path).toBe('band.maxHz');
    expect(firstIssue({ ...good, observed: [{ ...good.observed[0], power: [1] }] }).path).toBe('observed.0.power');
    expect(firstIssue({ ...good, observed: [{ ...good.observed[0], station: 'ZZZ' }] })).toEqual({ path: 'observed.0.station', message: 'no station with code "ZZZ"' });
    expect(firstIssue({ ...good, unknowns: [{ ...good.unknowns[0], intensity: { min: 5, max: 1 } }] }).path).toBe('unknowns.0.intensity.max');
    expect(firstIssue({ ...good, stations: [good.stations[0], good.stations[0]] }).path).toBe('stations.1.code');
    expect(firstIssue({ ...good, sources: [] }, forwardCaseSchema).path).toBe('sources');
    expect(firstIssue({ ...good, unknowns: undefined }, invertCaseSchema).path).toBe('unknowns');
  });

  it('checks a propagation table row by row and that the band lies inside it', () => {
    const table = { columns: 'speed-attenuation', rows: [[2, 1.5, 0.1], [20, 1.3, -0.3]] };
    expect(firstIssue({ ...good, cavity: { model: 'table', earthRadiusKm: 6371, heightKm: 60, table } }).path).toBe('cavity.table.rows.1.2');
    const ok = { columns: 'nu', rows: [[2, 0, -0.03], [20, 3, -0.3]] };
    expect(firstIssue({ ...good, cavity: { model: 'table', earthRadiusKm: 6371, heightKm: 60, table: ok } }).message).toMatch(/outside the propagation table/);
  });
});
