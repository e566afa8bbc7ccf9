/**
 * A figure described once, drawn in two places: on the server into the page's
 * HTML (`renderFigureSvg`, so the first view shows every figure before any
 * chart code reaches the browser) and in the browser by `PlotFigure` (at the
 * box's real width, with hover tips). Both call `plotOptions`, so the two
 * drawings differ only in width. No React and no Plot import here: the module
 * is shared by server and client code.
 */
import type * as Plot from '@observablehq/plot';
import type { PlotModule } from './plot-module';

export interface FigureSpec {
  /** Accessible name and visible heading of the figure. */
  title: string;
  /** x-axis label with unit, e.g. "Frequency (Hz)". */
  xLabel: string;
  /** y-axis label with unit, e.g. "PSD ((mV/m)^2/Hz)". */
  yLabel: string;
  /** One-line explanation under the figure. */
  caption?: string;
  height: number;
  /** The figure's marks and scales (without axis labels), from the Plot module. */
  build: (Plot: PlotModule) => Plot.PlotOptions;
}

/** The frame every figure shares (theme colours, font, margins, labels) around its own options. */
export function plotOptions(
  options: Plot.PlotOptions,
  frame: { title: string; xLabel: string; yLabel: string; height: number; width: number },
): Plot.PlotOptions {
  return {
    style: {
      background: 'transparent',
      color: 'currentColor',
      fontFamily: 'var(--font-sans)',
      fontSize: '11px',
      overflow: 'visible',
    },
    marginLeft: 56,
    height: frame.height,
    width: frame.width,
    ...options,
    x: { ...(options.x ?? {}), label: frame.xLabel },
    y: { grid: true, ...(options.y ?? {}), label: frame.yLabel },
    ariaLabel: frame.title,
  };
}

/** Widths the server draws at: the page column and half of it on a 1280-px-wide window. */
export const SERVER_WIDTH = { full: 1180, half: 580 } as const;
