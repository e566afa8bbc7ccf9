/**
 * The run page's first view drawn on the server: the figures `RunPage` opens
 * on (the last solved interval, its best minimum, the first fitted series) as
 * SVG markup, so they stand in the HTML before any chart code runs. Server
 * code only (the run page route); the client gets strings.
 */
import { renderFigureSvg } from '@/src/web/charts/render-svg';
import { SERVER_WIDTH } from '@/src/web/charts/figure-spec';
import type { RunView } from '@/src/runs/results';
import type { RunFits } from '@/src/runs/fits';
import { seriesFigure } from './series';
import { correlationFigure } from './correlation';
import { startsFigure } from './starts';
import { fitFigures } from './fits';
import { regionColours, solvedIntervals } from '@/src/runs/view-select';

/** Markup per figure of the first view; null where the figure is not on it (or the browser must draw it). */
export interface FirstFigures {
  series: string | null;
  correlation: string | null;
  starts: string | null;
  power: string | null;
  residual: string | null;
}

export function firstFigures(view: RunView, fits: RunFits | null): FirstFigures {
  const solved = solvedIntervals(view.intervals);
  const open = solved.at(-1);
  const best = open?.result?.minima[0];
  const first = fits?.series[0];
  const fit = first ? fitFigures(first) : null;
  return {
    series:
      solved.length > 1
        ? renderFigureSvg(seriesFigure(view.intervals, regionColours(view.grid.regions), view.goodness), SERVER_WIDTH.full)
        : null,
    correlation: best ? renderFigureSvg(correlationFigure(best), SERVER_WIDTH.half) : null,
    starts: open?.result && best ? renderFigureSvg(startsFigure(open.result, 0), SERVER_WIDTH.half) : null,
    power: fit ? renderFigureSvg(fit.power, SERVER_WIDTH.full) : null,
    residual: fit ? renderFigureSvg(fit.residual, SERVER_WIDTH.full) : null,
  };
}
