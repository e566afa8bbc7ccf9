/**
 * The global siting grid: each site's rating is the ratio of the linearised error with a station there to the
 * error without it (the same numbers `siting` reports for that site), never above 1 (adding data cannot widen a
 * linearised error; Tarantola 2005, Inverse Problem Theory, §3.2), best near a region the network sees poorly;
 * sites on a station or a source are left out, and a measure that is no parameter is refused by name.
 */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { studyFromCase } from '@/src/engine/case/study-input';
import { studyCaseSchema } from '@/src/engine/case/study-schema';
import { siteGrid } from '@/src/engine/studies/site-grid';
import { sitingStudy } from '@/src/engine/studies/siting';

const input = studyFromCase(studyCaseSchema.parse(JSON.parse(readFileSync('fixtures/studies/siting-case.json', 'utf8'))));

describe('site grid', () => {
  it('rates every free site by the error ratio siting reports, at most 1, best near the region seen from afar', () => {
    const grid = siteGrid(input, { stepDeg: 15, components: ['Ez', 'Bns', 'Bew'], measure: 'R2.lat' });
    expect(grid.parameters).toEqual(['R1.intensity', 'R1.lat', 'R1.lon', 'R2.intensity', 'R2.lat', 'R2.lon']);
    expect(grid.sites).toHaveLength(12 * 24);
    for (const s of grid.sites) expect(s.ratio).toBeLessThanOrEqual(1 + 1e-9);
    const best = grid.sites.reduce((a, b) => (b.ratio < a.ratio ? b : a));
    expect(Math.hypot(best.lat - -6, best.lon - -61.5)).toBeLessThan(40);
    const one = sitingStudy(input, [{ lat: best.lat, lon: best.lon, components: ['Ez', 'Bns', 'Bew'] }]);
    expect(best.ratio).toBeCloseTo(one.candidates[0].stdErrors.R2.lat! / one.baseline.stdErrors.R2.lat!, 10);
  });

  it('gives the volume ratio per axis, leaves out sites on a station, and refuses an unknown measure', () => {
    const grid = siteGrid(input, { stepDeg: 30, components: ['Ez'], measure: 'volume' });
    for (const s of grid.sites) {
      expect(s.ratio).toBeGreaterThan(0);
      expect(s.ratio).toBeLessThanOrEqual(1 + 1e-9);
    }
    const onStation = { ...input, stations: [...input.stations, { code: 'X', lat: 15, lon: 15, components: ['Ez' as const] }] };
    expect(
      siteGrid(onStation, { stepDeg: 30, components: ['Ez'] }).sites.find((s) => s.lat === 15 && s.lon === 15),
    ).toBeUndefined();
    expect(() => siteGrid(input, { stepDeg: 30, components: ['Ez'], measure: 'R3.lat' })).toThrow(/measure: "R3\.lat"/);
    expect(() => siteGrid(input, { stepDeg: 7, components: ['Ez'] })).toThrow(/stepDeg/);
  });
});
