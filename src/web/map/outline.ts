/**
 * The map's fixed layers as SVG path strings: the sphere, a 30° graticule and
 * Natural Earth land at 1:110m (world-atlas), projected once per map size and
 * kept in memory. Points are rounded to 0.1 px, well below what a screen shows,
 * and written as relative steps between the rounded points (SVG `l`, no drift),
 * which makes the land about half as long as d3's own absolute path at three
 * decimals; the strings travel twice (HTML and the page's data).
 */
import { geoGraticule, geoPath, type GeoContext } from 'd3-geo';
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

/** A d3-geo path context writing SVG path data with relative line steps between points rounded to `OUTLINE_DIGITS`. */
class RelativePath implements GeoContext {
  private out: string[] = [];
  private x = 0;
  private y = 0;
  private readonly scale = 10 ** OUTLINE_DIGITS;

  private num(units: number): string {
    return String(units / this.scale).replace(/^(-?)0\./, '$1.'); // "0.5" -> ".5", "-0.5" -> "-.5"
  }

  moveTo(px: number, py: number): void {
    this.x = Math.round(px * this.scale);
    this.y = Math.round(py * this.scale);
    this.out.push(`M${this.num(this.x)},${this.num(this.y)}`);
  }

  lineTo(px: number, py: number): void {
    const x = Math.round(px * this.scale);
    const y = Math.round(py * this.scale);
    const dy = this.num(y - this.y);
    this.out.push(`l${this.num(x - this.x)}${dy.startsWith('-') ? '' : ','}${dy}`);
    this.x = x;
    this.y = y;
  }

  beginPath(): void {}

  closePath(): void {
    this.out.push('z');
  }

  arc(): void {
    throw new Error('the world outline has no circles'); // geoPath only arcs for point radii
  }

  result(): string {
    const d = this.out.join('');
    this.out = [];
    return d;
  }
}

export function worldOutline(width: number, height: number): WorldOutline {
  const key = `${width}x${height}`;
  let hit = cache.get(key);
  if (!hit) {
    const context = new RelativePath();
    const path = geoPath(makeProjection(width, height), context);
    const draw = (o: Parameters<typeof path>[0]) => {
      path(o);
      return context.result();
    };
    hit = { sphere: draw(SPHERE), graticule: draw(graticule), land: draw(land) };
    cache.set(key, hit);
  }
  return hit;
}
