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
import { REGION_COLOURS } from '@/src/design/tokens';

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

/** Class of every figure's SVG (legends get `-ramp`, `-swatches`, `-figure`): styled in app/globals.css. */
export const FIGURE_CLASS = 'cv-plot';

/**
 * Our chart style, one place for all figures: axis lines on the left and at the bottom, ticks pointing
 * inward (4 px) with numbers outside them, axis labels without arrows (the unit is in the label), a faint
 * grid on the value axis, the app's sans-serif with tabular figures (set by class, no inline style), and
 * the design tokens' region colours for categories unless a figure sets its own colour scale.
 */
const AXIS = { labelArrow: 'none', line: true, tickSize: -4, tickPadding: 9 } as const;

/** The frame every figure shares (style, margins, labels) around its own options. */
export function plotOptions(
  options: Plot.PlotOptions,
  frame: { title: string; xLabel: string; yLabel: string; height: number; width: number },
): Plot.PlotOptions {
  const colour = options.color;
  const ownColours =
    colour && (colour.range !== undefined || colour.scheme !== undefined || colour.interpolate !== undefined || colour.type);
  return {
    className: FIGURE_CLASS,
    marginLeft: 60,
    marginBottom: 40,
    height: frame.height,
    width: frame.width,
    ...options,
    color: ownColours ? colour : { range: [...REGION_COLOURS], ...(colour ?? {}) },
    x: { ...AXIS, ...(options.x ?? {}), label: frame.xLabel },
    y: { ...AXIS, grid: true, ...(options.y ?? {}), label: frame.yLabel },
    ariaLabel: frame.title,
  } as Plot.PlotOptions;
}

/**
 * What Plot writes beside our style, taken out of a drawn figure (server or browser) before it reaches
 * the page: its <style> elements and inline style attributes (the stylesheet styles `cv-plot…` classes
 * instead, so figures need no inline CSS under a strict Content-Security-Policy) and its default font
 * attributes.
 */
export function finishFigure<T extends Element>(node: T): T {
  const all = [node, ...Array.from(node.querySelectorAll('*'))];
  for (const el of all) {
    if (el.tagName.toLowerCase() === 'style') {
      el.remove();
      continue;
    }
    el.removeAttribute('style');
    if (el.getAttribute('font-family') === 'system-ui, sans-serif') el.removeAttribute('font-family');
    // Plot names each mark's element ("line", "frame"); on an element without a role ARIA forbids a
    // name (WAI-ARIA 1.2, naming prohibited). The figure is named on its <svg>; the mark's kind
    // stays as data-mark.
    const mark = el.tagName.toLowerCase() !== 'svg' && !el.hasAttribute('role') ? el.getAttribute('aria-label') : null;
    if (mark !== null) {
      el.setAttribute('data-mark', mark);
      el.removeAttribute('aria-label');
    }
  }
  return node;
}

/** Widths the server draws at: the page column and half of it on a 1280-px-wide window. */
export const SERVER_WIDTH = { full: 1180, half: 580 } as const;
