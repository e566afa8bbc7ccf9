'use client';
/** Mode frequency, Q-factor and peak amplitude of the first four modes over the day, with ±1 standard error bars. */
import { useMemo } from 'react';
import * as Plot from '@observablehq/plot';
import { PlotFigure } from '@/src/web/charts/PlotFigure';
import { qFactorError } from '../fit-curve';
import { dayAxis, displayUnit, toDisplayPower, type Interval } from './types';

interface Point {
  t: Date;
  mode: string;
  /** value and standard error of frequency (f), Q (q) and amplitude (a) */
  f: number;
  df: number;
  q: number;
  dq: number;
  a: number;
  da: number;
}

const CAPTION = "Bars: ±1 standard error from each interval's mode fit.";

/** One quantity against time; on a log axis only positive values show and a bar reaching zero is cut at a hundredth of the value. */
function Trend({
  title,
  yLabel,
  points,
  value,
  error,
  log = false,
  legend = false,
  dayStart,
}: {
  title: string;
  yLabel: string;
  points: Point[];
  value: 'f' | 'q' | 'a';
  error: 'df' | 'dq' | 'da';
  log?: boolean;
  legend?: boolean;
  dayStart: number;
}) {
  const shown = log ? points.filter((d) => d[value] > 0) : points;
  const low = (d: Point) => (log ? Math.max(d[value] - d[error], d[value] / 100) : d[value] - d[error]);
  return (
    <PlotFigure
      title={title}
      caption={CAPTION}
      xLabel="Interval start (UTC)"
      yLabel={yLabel}
      height={240}
      options={{
        marginBottom: 40,
        x: dayAxis(dayStart),
        ...(log ? { y: { type: 'log' as const } } : {}),
        ...(legend ? { color: { legend: true } } : {}),
        marks: [
          Plot.ruleX(
            shown.filter((d) => Number.isFinite(d[error])),
            { x: 't', y1: low, y2: (d: Point) => d[value] + d[error], stroke: 'mode', strokeOpacity: 0.7 },
          ),
          Plot.dot(shown, { x: 't', y: value, fill: 'mode', r: 2 }),
        ],
      }}
    />
  );
}

export function ModeTrends({ intervals, component, dayStart }: { intervals: Interval[]; component: string; dayStart: number }) {
  const points = useMemo(
    () =>
      intervals.flatMap((iv) =>
        (iv.fit?.modes ?? []).slice(0, 4).map((m, n) => ({
          t: new Date(iv.startsAt),
          mode: `mode ${n + 1}`,
          f: m.frequency,
          df: m.errors.frequency,
          q: m.q,
          dq: qFactorError(m),
          a: toDisplayPower(component, m.amplitude),
          da: toDisplayPower(component, m.errors.amplitude),
        })),
      ),
    [intervals, component],
  );
  if (!points.length) return null;
  const common = { points, dayStart };
  return (
    <div className="grid gap-6 lg:grid-cols-3">
      <Trend title="Mode frequencies" yLabel="Frequency (Hz)" value="f" error="df" legend {...common} />
      <Trend title="Q-factors" yLabel="Q (dimensionless)" value="q" error="dq" {...common} />
      <Trend
        title="Mode intensities"
        yLabel={`Peak amplitude (${displayUnit(component)})`}
        value="a"
        error="da"
        log
        {...common}
      />
    </div>
  );
}
