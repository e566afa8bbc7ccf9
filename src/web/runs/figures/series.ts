/**
 * Daily curves: each region's intensity (best minimum per interval) with a ±1σ band, on a UT axis.
 * Intervals whose fit is implausible (src/runs/goodness.ts) are marked by a dashed vertical line and a cross
 * at the top; the caption says whether the errors are as stated or scaled by the misfit.
 */
import type * as Plot from '@observablehq/plot';
import type { FigureSpec } from '@/src/web/charts/figure-spec';
import type { IntervalView } from '@/src/runs/results';
import { cssVar, regionColour } from '@/src/design/tokens';
import type { RunGoodness } from '@/src/runs/goodness';

/** Colour of the implausible-fit marks: the interface's warning colour, none of the region colours. */
const IMPLAUSIBLE_COLOUR = cssVar('danger');

export function seriesFigure(intervals: IntervalView[], colours: Record<string, string>, goodness?: RunGoodness): FigureSpec {
  const pts = intervals.flatMap((iv) => {
    const m = iv.result?.minima[0];
    if (!m) return [];
    return m.sources.map((s) => {
      const e = m.stdErrors[s.name]?.intensity ?? 0;
      return { t: new Date(iv.startsAt), region: s.name, I: s.intensity, lo: Math.max(1, s.intensity - e), hi: s.intensity + e };
    });
  });
  const names = [...new Set(pts.map((p) => p.region))];
  const implausible = (goodness?.intervals ?? [])
    .filter((g) => g.implausible)
    .map((g) => ({ t: new Date(g.startsAt), p: g.p, chi2: g.chi2, dof: g.dof }));
  const scaled = intervals.some((iv) => {
    const e = (iv.result?.minima[0] as { errorScale?: number } | undefined)?.errorScale;
    return e !== undefined && e !== 1;
  });
  const marked = implausible.length
    ? ` Dashed lines with a cross: ${implausible.length} interval(s) whose fit is implausible (P(≥ χ²) < ${goodness!.threshold}).`
    : '';
  return {
    title: 'Regional intensity through the day',
    xLabel: 'Time (UT)',
    yLabel: 'Intensity (C² km²/s)',
    height: 280,
    caption: `Best minimum of each interval; the band is ±1 standard error${scaled ? ', scaled by the misfit where χ²/dof is above 1' : ' as stated'}.${marked}`,
    build: (P) =>
      ({
        y: { type: 'log' },
        x: { type: 'utc', tickFormat: '%H:%M' },
        color: { legend: true, domain: names, range: names.map((n) => colours[n] ?? regionColour(0)) },
        marks: [
          P.ruleX(implausible, { x: 't', stroke: IMPLAUSIBLE_COLOUR, strokeDasharray: '4 3', strokeWidth: 1 }),
          P.dot(implausible, {
            x: 't',
            frameAnchor: 'top',
            symbol: 'times',
            stroke: IMPLAUSIBLE_COLOUR,
            r: 4,
            title: (d: { t: Date; p: number; chi2: number; dof: number }) =>
              `${d.t.toISOString().slice(11, 16)} UT: fit implausible, χ² ${d.chi2.toPrecision(4)} for ${d.dof} dof, P = ${d.p.toPrecision(2)}`,
          }),
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
