/**
 * From a validated study case (study-schema.ts) to the studies' input: the
 * stations with their components, the named sources (a source given by grid
 * cells becomes its cells' centre nodes, as an unknown given by cells does),
 * the unknowns exactly as `invert` reads them, and the noise.
 */
import type { CavityConfig } from '@/src/engine/cavity';
import { InversionInputError } from '@/src/engine/inverse/errors';
import { cellRegion } from '@/src/engine/sources/cell-region';
import type { StudyInput, StudySource } from '@/src/engine/studies/types';
import { unknownsFromCase } from './spectrum-input';
import type { StudyCase } from './study-schema';

function studySources(c: StudyCase): StudySource[] {
  return (c.sources ?? []).map((s, i) => {
    if (!s.name)
      throw new InversionInputError(`sources[${i}].name: a study's source needs the name of the unknown it stands for`);
    const base = { name: s.name, intensity: s.intensity, ...(s.spreadDeg !== undefined ? { spreadDeg: s.spreadDeg } : {}) };
    if (!s.cells) return { ...base, lat: s.lat!, lon: s.lon! };
    const region = cellRegion(s.cells.cellSizeDeg, s.cells.ids);
    return { ...base, lat: region.lat, lon: region.lon, footprint: region.nodes };
  });
}

export function studyFromCase(c: StudyCase): StudyInput {
  return {
    cavity: c.cavity as CavityConfig,
    band: c.band,
    stations: c.stations.map((s) => ({ code: s.code, lat: s.lat, lon: s.lon, components: s.components })),
    sources: studySources(c),
    unknowns: unknownsFromCase(c),
    noise: {
      ...(c.noise.sigmaLog !== undefined ? { sigmaLog: c.noise.sigmaLog } : {}),
      ...(c.noise.welch ? { welch: c.noise.welch } : {}),
    },
  };
}
