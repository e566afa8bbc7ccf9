/**
 * The forward sources of a case file: a point or spot source as given, and a
 * source placed by grid cells as one point source per cell centre carrying the
 * cell's share of the intensity by area (regionSources) — the same nodes the
 * inverter uses for a cell region, so that forward and invert agree.
 */
import { makeGlobalGrid, regionSources } from '../sources/grid';
import type { ForwardSource } from '../sources/types';
import type { CaseFile } from './schema';

type CaseSource = NonNullable<CaseFile['sources']>[number];

export function forwardSources(sources: readonly CaseSource[]): ForwardSource[] {
  return sources.flatMap((s, i) => {
    if (s.cells) {
      const name = s.name ?? `sources[${i}]`;
      return regionSources(makeGlobalGrid(s.cells.cellSizeDeg), s.cells.ids, s.intensity).map((c) => ({
        ...c,
        name: `${name} ${c.name}`,
      }));
    }
    return [
      {
        ...(s.name ? { name: s.name } : {}),
        lat: s.lat!,
        lon: s.lon!,
        intensity: s.intensity,
        ...(s.spreadDeg !== undefined ? { spreadDeg: s.spreadDeg } : {}),
      },
    ];
  });
}
