'use client';
/**
 * Renders an Observable Plot figure. Every figure must name its axes with
 * units (`xLabel`, `yLabel`); they override any label in `options`.
 * Colours follow the theme through CSS variables (currentColor for ink).
 *
 *   <PlotFigure title="Spectrum, 06:20 UTC" xLabel="Frequency (Hz)" yLabel="PSD (pT^2/Hz)"
 *     options={{ marks: [Plot.line(points, { x: 'f', y: 'p', stroke: 'var(--c-accent)' })], y: { type: 'log' } }} />
 */
import { useEffect, useRef } from 'react';
import * as Plot from '@observablehq/plot';

export interface PlotFigureProps {
  /** Plot options without axis labels (given separately, below). */
  options: Plot.PlotOptions;
  /** Accessible name and visible heading of the figure. */
  title: string;
  /** x-axis label with unit, e.g. "Frequency (Hz)". */
  xLabel: string;
  /** y-axis label with unit, e.g. "PSD ((mV/m)^2/Hz)". */
  yLabel: string;
  /** One-line explanation under the figure. */
  caption?: string;
  height?: number;
  /** Width in px; by default the figure fills its container. */
  width?: number;
  className?: string;
}

export function PlotFigure({ options, title, xLabel, yLabel, caption, height = 280, width, className }: PlotFigureProps) {
  const ref = useRef<HTMLDivElement>(null);

  useEffect(() => {
    const host = ref.current;
    if (!host) return;
    let drawnWidth = -1;
    const draw = () => {
      const w = width ?? Math.max(280, host.clientWidth);
      if (w === drawnWidth) return; // the observer's first call and height-only changes need no redraw
      drawnWidth = w;
      const fig = Plot.plot({
        style: { background: 'transparent', color: 'currentColor', fontFamily: 'var(--font-sans)', fontSize: '11px', overflow: 'visible' },
        marginLeft: 56,
        height,
        width: w,
        ...options,
        x: { ...(options.x ?? {}), label: xLabel },
        y: { grid: true, ...(options.y ?? {}), label: yLabel },
        ariaLabel: title,
      });
      host.replaceChildren(fig);
    };
    draw();
    if (width) return;
    const ro = new ResizeObserver(() => draw());
    ro.observe(host);
    return () => ro.disconnect();
  }, [options, title, xLabel, yLabel, height, width]);

  return (
    <figure className={className}>
      <figcaption className="mb-1 text-sm font-semibold">{title}</figcaption>
      <div ref={ref} className="w-full text-fg" style={{ minHeight: height }} />
      {caption ? <p className="mt-1 text-xs text-muted">{caption}</p> : null}
    </figure>
  );
}
