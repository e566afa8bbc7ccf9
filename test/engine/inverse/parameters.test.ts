/**
 * Parameterisation: names follow the regions; intensity is searched as its
 * natural logarithm; a longitude range across the antimeridian is unwrapped
 * (min 170, max -170 becomes 170..190) and results are wrapped back to
 * (-180, 180]; fixed quantities are not parameters.
 */
import { describe, expect, it } from 'vitest';
import { buildParameterisation, physicalParams, sourcesOf } from '@/src/engine/inverse/parameters';

describe('parameterisation', () => {
  const par = buildParameterisation([
    { name: 'Pacific', intensity: { min: 100, max: 1e5 }, lat: { min: -10, max: 10 }, lon: { min: 170, max: -170 } },
    { name: 'Andes', intensity: 5e3, lat: -15, lon: { min: -75, max: -60 }, spread: { min: 0, max: 5 } },
  ]);
  it('names the free parameters and keeps internal bounds (ln intensity, unwrapped longitude)', () => {
    expect(par.names).toEqual(['Pacific.intensity', 'Pacific.lat', 'Pacific.lon', 'Andes.lon', 'Andes.spread']);
    expect(par.lower[0]).toBeCloseTo(Math.log(100), 14);
    expect(par.upper[0]).toBeCloseTo(Math.log(1e5), 14);
    expect([par.lower[2], par.upper[2]]).toEqual([170, 190]);
  });
  it('maps a free vector back to sources with wrapped longitudes and fixed values filled in', () => {
    const x = [Math.log(2500), 3, 185, -70, 2];
    expect(sourcesOf(par, x)).toEqual([
      { name: 'Pacific', lat: 3, lon: -175, intensity: expect.closeTo(2500, 9) },
      { name: 'Andes', lat: -15, lon: -70, intensity: expect.closeTo(5000, 9), spread: 2 },
    ]);
    expect(physicalParams(par, x)['Pacific.lon']).toBe(-175);
  });
});
