/**
 * Daily curves of two runs overlaid: each region's intensity (best minimum per
 * interval) with its ±1σ band, in the region's own colour in both runs (A a
 * solid line, B dashed), on one UT axis and one logarithmic intensity scale.
 */
import type * as Plot from '@observablehq/plot';
import type { FigureSpec } from '@/src/web/charts/figure-spec';
import type { PlotModule } from '@/src/web/charts/plot-module';
import type { IntervalView } from '@/src/runs/results';
import { regionColour } from '@/src/design/tokens';

interface Point {
  run: 'A' | 'B';
  key: string;
  t: Date;
  region: string;
  I: number;
  lo: number;
  hi: number;
}

function points(run: 'A' | 'B', intervals: IntervalView[]): Point[] {
  return intervals.flatMap((iv) => {
    const m = iv.result?.minima[0];
    if (!m) return [];
    return m.sources.map((s) => {
      const e = m.stdErrors[s.name]?.intensity ?? 0;
      return {
        run,
        key: `${run} · ${s.name}`,
        t: new Date(iv.startsAt),
        region: s.name,
        I: s.intensity,
        lo: Math.max(1, s.intensity - e),
        hi: s.intensity + e,
      };
    });
  });
}

export function compareSeriesFigure(a: IntervalView[], b: IntervalView[], colours: Record<string, string>): FigureSpec {
  const pa = points('A', a);
  const pb = points('B', b);
  const names = [...new Set([...pa, ...pb].map((p) => p.region))];
  const line = (P: PlotModule, pts: Point[], dash: string | undefined) =>
    P.line(pts, { x: 't', y: 'I', z: 'key', stroke: 'region', strokeWidth: 1.5, ...(dash ? { strokeDasharray: dash } : {}) });
  return {
    title: 'Best-minimum intensities of both runs',
    xLabel: 'Time (UT)',
    yLabel: 'Intensity (C² km²/s)',
    height: 300,
    caption: 'Each region in its own colour in both runs: A solid, B dashed; the bands are ±1 standard error.',
    build: (P) =>
      ({
        y: { type: 'log' },
        x: { type: 'utc', tickFormat: '%H:%M' },
        color: { legend: true, domain: names, range: names.map((n, i) => colours[n] ?? regionColour(i)) },
        marks: [
          P.areaY([...pa, ...pb], { x: 't', y1: 'lo', y2: 'hi', z: 'key', fill: 'region', fillOpacity: 0.15 }),
          line(P, pa, undefined),
          line(P, pb, '5,3'),
          P.dot([...pa, ...pb], {
            x: 't',
            y: 'I',
            fill: 'region',
            r: 2,
            title: (d: Point) => `${d.key} ${d.t.toISOString().slice(11, 16)} UT: ${d.I.toPrecision(3)} C² km²/s`,
          }),
        ],
      }) as unknown as Plot.PlotOptions,
  };
}
