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

  it('places a source or an unknown by grid cells instead of lat/lon, the unknown as a fixed footprint', () => {
    const polarRow = Array.from({ length: 36 }, (_, i) => 17 * 36 + i); // 10-degree cells north of 80 N
    const r = caseSchema.parse({
      ...good,
      sources: [{ name: 'Cap', cells: { cellSizeDeg: 10, ids: polarRow }, intensity: 5e4 }],
      unknowns: [{ name: 'Cap', cells: { cellSizeDeg: 10, ids: polarRow }, intensity: { min: 100, max: 1e6 } }],
    });
    expect(r.sources![0].cells!.ids).toEqual(polarRow);
    expect(r.unknowns![0]).toMatchObject({ name: 'Cap', intensity: { min: 100, max: 1e6 } });
    expect(r.unknowns![0].lat as number).toBeCloseTo(90, 9);
    expect(r.unknowns![0].footprint).toHaveLength(36);
    expect(r.unknowns![0].footprint![0]).toEqual({ lat: 85, lon: -175, weight: expect.closeTo(1 / 36, 14) });
  });

  it('names the field at fault when a region is placed wrongly', () => {
    const cells = { cellSizeDeg: 10, ids: [1, 2] };
    expect(firstIssue({ ...good, unknowns: [{ name: 'R1', intensity: { min: 1, max: 2 }, lat: 3 }] })).toEqual({
      path: 'unknowns.0.lon',
      message: 'lon is required (or give cells)',
    });
    expect(firstIssue({ ...good, unknowns: [{ ...good.unknowns[0], cells }] }).path).toBe('unknowns.0.cells');
    expect(firstIssue({ ...good, sources: [{ intensity: 1, cells: { cellSizeDeg: 10, ids: [700] } }] })).toEqual({
      path: 'sources.0.cells.ids',
      message: 'cell 700 is not in a 10-degree grid (ids 0 to 647)',
    });
    expect(firstIssue({ ...good, sources: [{ intensity: 1, cells: { cellSizeDeg: 7, ids: [1] } }] }).path).toBe(
      'sources.0.cells.cellSizeDeg',
    );
  });

  it('names the field at fault', () => {
    expect(firstIssue({ ...good, stations: [{ ...good.stations[0], lat: 95 }] }).path).toBe('stations.0.lat');
    expect(firstIssue({ ...good, cavity: { ...good.cavity, model: 'flat' } }).path).toBe('cavity.model');
    expect(firstIssue({ ...good, band: { minHz: 10, maxHz: 5, stepHz: 1 } }).path).toBe('band.maxHz');
    expect(firstIssue({ ...good, observed: [{ ...good.observed[0], power: [1] }] }).path).toBe('observed.0.power');
    expect(firstIssue({ ...good, observed: [{ ...good.observed[0], station: 'ZZZ' }] })).toEqual({
      path: 'observed.0.station',
      message: 'no station with code "ZZZ"',
    });
    expect(firstIssue({ ...good, unknowns: [{ ...good.unknowns[0], intensity: { min: 5, max: 1 } }] }).path).toBe(
      'unknowns.0.intensity.max',
    );
    expect(firstIssue({ ...good, stations: [good.stations[0], good.stations[0]] }).path).toBe('stations.1.code');
    expect(firstIssue({ ...good, sources: [] }, forwardCaseSchema).path).toBe('sources');
    expect(firstIssue({ ...good, unknowns: undefined }, invertCaseSchema).path).toBe('unknowns');
  });

  it('checks a propagation table row by row and that the band lies inside it', () => {
    const table = {
      columns: 'speed-attenuation',
      rows: [
        [2, 1.5, 0.1],
        [20, 1.3, -0.3],
      ],
    };
    expect(firstIssue({ ...good, cavity: { model: 'table', earthRadiusKm: 6371, heightKm: 60, table } }).path).toBe(
      'cavity.table.rows.1.2',
    );
    const ok = {
      columns: 'nu',
      rows: [
        [2, 0, -0.03],
        [20, 3, -0.3],
      ],
    };
    expect(firstIssue({ ...good, cavity: { model: 'table', earthRadiusKm: 6371, heightKm: 60, table: ok } }).message).toMatch(
      /outside the propagation table/,
    );
  });
});
