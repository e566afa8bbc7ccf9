/**
 * The run map tells what it shows: a colour bar with ticks and unit, confidence ellipses that stay
 * visible (enlarged by a stated factor when tiny), the spread of a moving region, and stations
 * without data marked as such. Ellipse levels are the two-parameter Delta chi2 of Press et al.,
 * Numerical Recipes §15.6 (2.30, 6.18).
 */
import { describe, expect, it } from 'vitest';
import { renderToStaticMarkup } from 'react-dom/server';
import { parseHTML } from 'linkedom';
import { RunMap, RunMapLayer, logTicks } from '@/src/web/runs/RunMap';
import { extentOf, magnification } from '@/src/web/map/magnify';
import type { Minimum } from '@/src/engine/inverse/types';
import type { Region } from '@/src/runs/grid-spec';
import { beltRegion } from './belt-region';

describe('magnification', () => {
  it('picks the least of 1, 2, 5, 10, … that reaches the minimum size', () => {
    expect(magnification(20)).toBe(1);
    expect(magnification(8)).toBe(2);
    expect(magnification(2)).toBe(10);
    expect(magnification(0.5)).toBe(50);
    expect(magnification(0)).toBe(1);
    expect(
      extentOf([
        [0, 0],
        [3, 1],
        [1, 7],
      ]),
    ).toBe(7);
  });
});

describe('logTicks', () => {
  it('labels whole decades when the range spans them, else the ends and middle', () => {
    expect(logTicks(2.7, 5.2).map((t) => t.text)).toEqual(['10³', '10⁴', '10⁵']);
    expect(logTicks(3.1, 3.3).map((t) => t.at)).toEqual([3.1, 3.2, 3.3]);
  });
});

const regions: Region[] = [beltRegion('#425fe1', 8)];
const minimum = {
  misfit: 10,
  reducedChi2: 1,
  count: 1,
  startIndexes: [0],
  sources: [{ name: 'Belt', lat: 1, lon: 21, intensity: 2e4 }],
  params: {},
  internal: [],
  stdErrors: { Belt: { intensity: 900, lat: 0.1, lon: 0.15 } },
  correlation: {
    names: ['Belt.intensity', 'Belt.lat', 'Belt.lon'],
    matrix: [
      [1, 0, 0],
      [0, 1, 0.3],
      [0, 0.3, 1],
    ],
  },
  resolution: { names: [], matrix: [] },
  singular: false,
  rank: 3,
  stopReasons: {},
} as unknown as Minimum;

describe('run map', () => {
  const html = renderToStaticMarkup(
    <RunMap
      frame={
        <svg>
          <RunMapLayer width={900} height={460} />
        </svg>
      }
      regions={regions}
      cellSizeDeg={10}
      minimum={minimum}
      stations={[
        { station: 'NORA', lat: 50, lon: 10, chi2PerBin: 1.2, bins: 40 },
        { station: 'SILT', lat: -30, lon: 140, chi2PerBin: null, bins: 0 },
      ]}
    />,
  );
  const doc = parseHTML(`<html><body>${html}</body></html>`).document;

  it('has a colour bar with a unit and numbered ticks', () => {
    const bar = doc.querySelector('svg[aria-label^="Colour bar"]');
    expect(bar).not.toBeNull();
    expect(bar!.textContent).toContain('C² km²/s');
    expect(Array.from(bar!.querySelectorAll('g text')).length).toBeGreaterThanOrEqual(2);
  });

  it('draws both confidence ellipses as outlines after (over) the marker, enlarged and saying so', () => {
    const g = doc.querySelector('circle')!.parentElement!;
    const after = Array.from(g.children).slice(Array.from(g.children).indexOf(doc.querySelector('circle')!) + 1);
    const outlines = after
      .flatMap((c) => Array.from(c.querySelectorAll('path')))
      .filter((p) => p.getAttribute('stroke') === '#425fe1');
    expect(outlines.length).toBe(2);
    for (const p of outlines) expect(p.getAttribute('fill')).toBe('none');
    // 0.1-0.15 degree errors are about 1 px on a 900-px world map: the ellipses are enlarged
    expect(html).toMatch(/enlarged ×\d+/);
    expect(html).toContain('68 %');
    expect(html).toContain('95 %');
  });

  it("draws the moving region's spread and marks the station without data", () => {
    expect(html).toContain('spread 8°');
    expect(html).toContain('SILT (no data)');
    expect(html).toContain('without data in this interval');
    expect(html).not.toContain('NORA (no data)');
  });
});
