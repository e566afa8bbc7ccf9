/**
 * The map's fixed layers as SVG path strings: the sphere, a 30° graticule and
 * Natural Earth land at 1:110m (world-atlas), projected once per map size and
 * kept in memory. Coordinates are rounded to 0.1 px (d3-geo `path.digits`),
 * well below what a screen shows, which makes the strings about a quarter
 * shorter than at d3's default of three decimals.
 */
import { geoGraticule, geoPath } from 'd3-geo';
import { feature } from 'topojson-client';
import type { Topology, GeometryCollection } from 'topojson-specification';
import landTopo from 'world-atlas/land-110m.json';
import { SPHERE, makeProjection } from './projection';

export interface WorldOutline {
  sphere: string;
  graticule: string;
  land: string;
}

/** Decimal places of the path coordinates, in SVG pixels. */
export const OUTLINE_DIGITS = 1;
/** Spacing of the graticule's meridians and parallels, degrees. */
export const GRATICULE_STEP_DEG = 30;

const topology = landTopo as unknown as Topology;
const land = feature(topology, topology.objects.land as GeometryCollection);
const graticule = geoGraticule().step([GRATICULE_STEP_DEG, GRATICULE_STEP_DEG])();
const cache = new Map<string, WorldOutline>();

export function worldOutline(width: number, height: number): WorldOutline {
  const key = `${width}x${height}`;
  let hit = cache.get(key);
  if (!hit) {
    const path = geoPath(makeProjection(width, height)).digits(OUTLINE_DIGITS);
    hit = { sphere: path(SPHERE) ?? '', graticule: path(graticule) ?? '', land: path(land) ?? '' };
    cache.set(key, hit);
  }
  return hit;
}
