/** Daily curves: each region's intensity (best minimum per interval) with a ±1σ band, on a UT axis. */
import type * as Plot from '@observablehq/plot';
import type { FigureSpec } from '@/src/web/charts/figure-spec';
import type { IntervalView } from '@/src/runs/results';
import { regionColour } from '@/src/design/tokens';

export function seriesFigure(intervals: IntervalView[], colours: Record<string, string>): FigureSpec {
  const pts = intervals.flatMap((iv) => {
    const m = iv.result?.minima[0];
    if (!m) return [];
    return m.sources.map((s) => {
      const e = m.stdErrors[s.name]?.intensity ?? 0;
      return { t: new Date(iv.startsAt), region: s.name, I: s.intensity, lo: Math.max(1, s.intensity - e), hi: s.intensity + e };
    });
  });
  const names = [...new Set(pts.map((p) => p.region))];
  return {
    title: 'Regional intensity through the day',
    xLabel: 'Time (UT)',
    yLabel: 'Intensity (C² km²/s)',
    height: 280,
    caption: 'Best minimum of each interval; the band is ±1 standard error.',
    build: (P) =>
      ({
        y: { type: 'log' },
        x: { type: 'utc', tickFormat: '%H:%M' },
        color: { legend: true, domain: names, range: names.map((n) => colours[n] ?? regionColour(0)) },
        marks: [
          P.areaY(pts, { x: 't', y1: 'lo', y2: 'hi', fill: 'region', fillOpacity: 0.2 }),
          P.line(pts, { x: 't', y: 'I', stroke: 'region', strokeWidth: 1.5 }),
          P.dot(pts, {
            x: 't',
            y: 'I',
            fill: 'region',
            r: 2,
            title: (d: { region: string; I: number; t: Date }) =>
              `${d.region} ${d.t.toISOString().slice(11, 16)} UT: ${d.I.toPrecision(3)} C² km²/s`,
          }),
        ],
      }) as unknown as Plot.PlotOptions,
  };
}
