'use client';
/**
 * Renders an Observable Plot figure. Every figure must name its axes with
 * units (`xLabel`, `yLabel`); they override any label in `options`.
 * Colours follow the theme through CSS variables (currentColor for ink); our
 * chart style (`plotOptions`, `finishFigure`) is applied here and on the server.
 *
 * The heading, caption and a box of the figure's height come with the page;
 * Plot itself is loaded on demand (`loadPlot`) and draws into the box. Give
 * `options` as a function of the Plot module so the calling component needs no
 * Plot import of its own (memoise it: a new function redraws the figure):
 *
 *   const options = useMemo(() => (Plot: PlotModule) => ({
 *     marks: [Plot.line(points, { x: 'f', y: 'p', stroke: 'var(--c-accent)' })], y: { type: 'log' },
 *   }), [points]);
 *   <PlotFigure title="Spectrum, 06:20 UTC" xLabel="Frequency (Hz)" yLabel="PSD (pT^2/Hz)" options={options} />
 *
 * A figure the server has already drawn (`renderFigureSvg` of the same
 * `FigureSpec`) comes as `prerendered` markup: it shows from the first byte of
 * HTML and is replaced by the browser's own drawing (real width, hover tips)
 * once the chart code is here. A later change of options clears it at once,
 * so a stale drawing never stands for a new selection.
 */
import { useEffect, useRef, useState } from 'react';
import type * as Plot from '@observablehq/plot';
import { loadPlot, type PlotModule } from './plot-module';
import { finishFigure, plotOptions } from './figure-spec';
import { savePng, saveSvg } from '@/src/web/ui/export';

// A page with figures starts fetching the chart code while it hydrates, not after.
if (typeof window !== 'undefined') loadPlot().catch(() => {});

export interface PlotFigureProps {
  /** Plot options without axis labels (given separately, below), or a function building them from the Plot module. */
  options: Plot.PlotOptions | ((Plot: PlotModule) => Plot.PlotOptions);
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
  /** The server's drawing of these options (SVG markup), shown until the browser draws. */
  prerendered?: string | null;
}

export function PlotFigure({
  options,
  title,
  xLabel,
  yLabel,
  caption,
  height = 280,
  width,
  className,
  prerendered,
}: PlotFigureProps) {
  const ref = useRef<HTMLDivElement>(null);
  const lastBoxWidth = useRef<number | null>(null);
  // Markup fixed at mount: React never rewrites it; the effect below replaces it with the live drawing.
  const [serverMarkup] = useState(() => (prerendered ? { __html: prerendered } : undefined));
  const effects = useRef(0);

  useEffect(() => {
    const host = ref.current;
    if (!host) return;
    if (effects.current++ > 0 && host.dataset.drawn !== 'client') host.replaceChildren(); // the server's drawing is of older options
    let drawnWidth = -1;
    let lib: PlotModule | null = null;
    let built: Plot.PlotOptions | null = null;
    let gone = false;
    // The box's width comes from the resize observer (measured in the browser's own layout pass),
    // never from reading clientWidth: with several figures, each read would force a fresh layout
    // of the whole page after the previous figure went in.
    let boxWidth = width ?? lastBoxWidth.current;
    const draw = () => {
      if (!lib || !built || boxWidth === null) return; // chart code or the box's width still to come
      const w = width ?? Math.max(280, boxWidth);
      if (w === drawnWidth) return; // the observer's first call and height-only changes need no redraw
      drawnWidth = w;
      const options = built;
      const t0 = performance.now();
      const fig = finishFigure(lib.plot(plotOptions(options, { title, xLabel, yLabel, height, width: w })));
      host.replaceChildren(fig);
      host.dataset.drawn = 'client'; // read by the page benchmark (figures live, tips on hover)
      performance.measure(`figure: ${title}`, { start: t0, end: performance.now() }); // shows in a browser profile's timings
    };
    loadPlot().then(
      (mod) => {
        if (gone) return;
        lib = mod;
        built = typeof options === 'function' ? options(mod) : options;
        draw();
      },
      (e: unknown) => {
        if (gone) return;
        const p = document.createElement('p');
        p.className = 'text-sm text-danger';
        p.textContent = `The figure could not be drawn: the chart code did not load (${(e as Error).message}). Reload the page to try again.`;
        host.replaceChildren(p);
      },
    );
    const ro = width
      ? null
      : new ResizeObserver((entries) => {
          const box = entries.at(-1);
          if (!box) return;
          boxWidth = box.contentRect.width;
          lastBoxWidth.current = boxWidth;
          draw();
        });
    ro?.observe(host);
    return () => {
      gone = true;
      ro?.disconnect();
    };
  }, [options, title, xLabel, yLabel, height, width]);

  return (
    <figure className={className}>
      <figcaption className="mb-1 flex items-baseline justify-between gap-3 text-sm font-semibold">
        <span>{title}</span>
        <span className="flex gap-1 text-xs font-normal">
          {(['SVG', 'PNG'] as const).map((kind) => (
            <button
              key={kind}
              type="button"
              className="rounded px-1.5 py-0.5 text-muted hover:bg-raised hover:text-fg"
              aria-label={`Download “${title}” as ${kind}`}
              onClick={() => {
                const svg = ref.current?.querySelector<SVGSVGElement>('svg.cv-plot');
                if (!svg) return;
                if (kind === 'SVG') saveSvg(title, svg);
                else void savePng(title, svg);
              }}
            >
              {kind}
            </button>
          ))}
        </span>
      </figcaption>
      <div
        ref={ref}
        className="w-full text-fg"
        style={{ minHeight: height }}
        dangerouslySetInnerHTML={serverMarkup}
        data-drawn={serverMarkup ? 'server' : undefined}
      />
      {caption ? <p className="mt-1 text-xs text-muted">{caption}</p> : null}
    </figure>
  );
}
