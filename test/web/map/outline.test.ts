import { describe, expect, it } from 'vitest';
import { geoGraticule, geoPath } from 'd3-geo';
import { feature } from 'topojson-client';
import type { Topology, GeometryCollection } from 'topojson-specification';
import landTopo from 'world-atlas/land-110m.json';
import { GRATICULE_STEP_DEG, OUTLINE_DIGITS, worldOutline } from '@/src/web/map/outline';
import { makeProjection } from '@/src/web/map/projection';

const numbers = (d: string) => (d.match(/-?(?:\d+(?:\.\d*)?|\.\d+)(?:e-?\d+)?/g) ?? []).map(Number);

/** Absolute vertices of an SVG path made of M/L (absolute), l (relative) and Z/z commands (SVG 1.1, 8.3). */
function vertices(d: string): number[] {
  const out: number[] = [];
  let x = 0;
  let y = 0;
  for (const [, cmd, args] of d.matchAll(/([MLlZz])([^MLlZz]*)/g)) {
    const v = numbers(args);
    if (cmd === 'Z' || cmd === 'z') continue;
    [x, y] = cmd === 'l' ? [x + v[0], y + v[1]] : [v[0], v[1]];
    out.push(x, y);
  }
  return out;
}
const W = 900;
const H = 460;

describe('world outline', () => {
  // Reference: d3-geo's own path of the same geometry at its default precision (three decimals).
  const reference = geoPath(makeProjection(W, H));
  const topology = landTopo as unknown as Topology;
  const land = feature(topology, topology.objects.land as GeometryCollection);

  it('draws the same land as d3-geo at full precision, each coordinate within half a rounding step', () => {
    const ours = vertices(worldOutline(W, H).land);
    const full = vertices(reference(land) ?? '');
    expect(ours.length).toBe(full.length);
    const halfStep = 0.5 * 10 ** -OUTLINE_DIGITS;
    let worst = 0;
    for (let i = 0; i < full.length; i++) worst = Math.max(worst, Math.abs(ours[i] - full[i]));
    expect(worst).toBeLessThanOrEqual(halfStep + 5e-4); // + the reference's own rounding to 1e-3
    expect(worldOutline(W, H).land.length).toBeLessThan((reference(land) ?? '').length * 0.6);
  });

  it('draws a 30° graticule: the same meridians and parallels as d3-geo geoGraticule().step([30, 30])', () => {
    const lines = geoGraticule().step([GRATICULE_STEP_DEG, GRATICULE_STEP_DEG]).lines();
    // Each line is one move-to in the path; the meridians every 30° of longitude (12 of them) and
    // the parallels every 30° of latitude (common practice for a world graticule).
    expect(GRATICULE_STEP_DEG).toBe(30);
    expect((worldOutline(W, H).graticule.match(/M/g) ?? []).length).toBe(lines.length);
    const ours = vertices(worldOutline(W, H).graticule);
    const full = vertices(reference(geoGraticule().step([30, 30])()) ?? '');
    expect(ours.length).toBe(full.length);
    ours.forEach((v, i) => expect(Math.abs(v - full[i])).toBeLessThanOrEqual(0.05 + 5e-4));
  });

  it('fits the sphere in the box with its 2 px margin (Equal Earth is about 2.05 times as wide as tall)', () => {
    const xs: number[] = [];
    const ys: number[] = [];
    vertices(worldOutline(W, H).sphere).forEach((v, i) => (i % 2 ? ys : xs).push(v));
    const width = Math.max(...xs) - Math.min(...xs);
    const height = Math.max(...ys) - Math.min(...ys);
    expect(Math.min(...xs)).toBeGreaterThanOrEqual(2 - 0.05);
    expect(Math.max(...xs)).toBeLessThanOrEqual(W - 2 + 0.05);
    expect(Math.max(...ys)).toBeLessThanOrEqual(H - 2 + 0.05);
    // Šavrič, Patterson & Jenny (2018): the Equal Earth map's width-to-height ratio is about 2.05:1.
    expect(width / height).toBeCloseTo(2.05, 1);
  });

  it('projects once per size and serves later calls from memory', () => {
    expect(worldOutline(W, H)).toBe(worldOutline(W, H));
    expect(worldOutline(600, 300)).not.toBe(worldOutline(W, H));
  });
});
