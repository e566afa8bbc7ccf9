/**
 * The multi-start picture: one mark per start at its own final misfit,
 * grouped by the minimum it is counted in (x, best first; spread sideways
 * within a group). Starts that reached a minimum are accent circles, starts
 * that stopped without converging are rose triangles (shape and colour
 * both differ, so the two read apart without colour vision). Hover a mark for
 * its start number, misfit, iterations and why it stopped. Results stored
 * before each start's own end was kept draw every start at its minimum's
 * misfit and say so.
 */
import type * as Plot from '@observablehq/plot';
import type { FigureSpec } from '@/src/web/charts/figure-spec';
import { CONVERGED_REASONS, type StopReason } from '@/src/engine/optim/types';
import type { InversionResult, StartStop } from '@/src/engine/inverse/types';
import { FIGURE } from '@/src/design/tokens';

/** Our words for why a start stopped. */
export const STOP_WORDS: Record<StartStop, string> = {
  'misfit-change': 'misfit stopped falling',
  'step-size': 'steps became negligible',
  gradient: 'gradient vanished',
  'max-iterations': 'ran out of iterations',
  'max-evaluations': 'ran out of misfit evaluations',
  'non-finite': 'misfit not finite',
  cancelled: 'cancelled',
  'early-stop': 'stopped early',
  clustered: 'stopped early: close to a minimum an earlier start had found',
};

const reachedMinimum = (r: StartStop) => r !== 'clustered' && CONVERGED_REASONS.includes(r as StopReason);

export const REACHED = FIGURE.reached;
export const STOPPED_SHORT = FIGURE.stoppedShort; // a triangle too, so it reads apart without colour

interface Dot {
  x: number;
  misfit: number;
  start: number;
  minimum: number;
  text: string;
  reached: boolean | null;
}

/** x of the k-th of `count` starts in a minimum's column: centred, at most 9 side by side. */
function spread(rank: number, k: number, count: number): number {
  const across = Math.min(count, 9);
  return rank + 1 + ((k % 9) - (across - 1) / 2) * 0.07;
}

function dotsOf(result: InversionResult): { dots: Dot[]; notDrawn: number } {
  const ends = result.startEnds;
  const dots: Dot[] = [];
  let notDrawn = 0;
  result.minima.forEach((m, rank) => {
    m.startIndexes.forEach((s, k) => {
      const at = ends ? ends.index.indexOf(s) : -1;
      if (!ends || at < 0) {
        dots.push({
          x: spread(rank, k, m.startIndexes.length),
          misfit: m.misfit,
          start: s,
          minimum: rank,
          reached: null,
          text: `Start ${s + 1} of ${result.starts}\nminimum #${rank + 1}, misfit ${m.misfit.toPrecision(6)}\n(own misfit not stored)`,
        });
        return;
      }
      const misfit = ends.misfit[at];
      const reason = ends.stopReason[at];
      if (misfit === null || !Number.isFinite(misfit)) {
        notDrawn++;
        return;
      }
      const reached = reachedMinimum(reason);
      dots.push({
        x: spread(rank, k, m.startIndexes.length),
        misfit,
        start: s,
        minimum: rank,
        reached,
        text: `Start ${s + 1} of ${result.starts}\nmisfit χ² ${misfit.toPrecision(6)}\n${ends.iterations[at]} iterations\nstopped: ${STOP_WORDS[reason] ?? reason}${reached ? '' : ' (not converged)'}\ncounted in minimum #${rank + 1}`,
      });
    });
  });
  return { dots, notDrawn };
}

function captionOf(result: InversionResult, notDrawn: number): string {
  if (!result.startEnds) {
    return `This result was stored before each start's own misfit was kept: every start is drawn at its minimum's misfit, and which starts converged is not known (${result.unconverged} of ${result.starts} did not).`;
  }
  const short = result.startEnds.stopReason.filter((r) => r !== 'clustered' && !reachedMinimum(r)).length;
  const clustered = result.startEnds.stopReason.filter((r) => r === 'clustered').length;
  const notSearched = clustered
    ? ` ${clustered} of ${result.starts} starts were stopped early, close to a minimum an earlier start had found, and are counted in it (drawn at the misfit where they stopped).`
    : '';
  return `Each mark is one start at its own final misfit, in the column of the minimum it is counted in (the selected one shaded). ${short ? `${short} of ${result.starts} starts stopped without converging and are counted with the nearest minimum.` : `All ${result.starts - clustered} searched starts converged.`}${notSearched}${notDrawn ? ` ${notDrawn} ${notDrawn === 1 ? 'start ended without a finite misfit and is' : 'starts ended without a finite misfit and are'} not drawn.` : ''}`;
}

export function startsFigure(result: InversionResult, selected: number): FigureSpec {
  const { dots, notDrawn } = dotsOf(result);
  const n = result.minima.length;
  const misfits = dots.map((d) => d.misfit);
  const [lo, hi] = [Math.min(...misfits), Math.max(...misfits)];
  // All starts at one misfit: a range of a scale without extent has no ticks, so give it ±0.1 % around the value.
  const flat = dots.length > 0 && hi - lo <= 1e-9 * Math.max(1, Math.abs(hi));
  const pad = Math.max(1e-3 * Math.abs(hi), 1e-6);
  const logScale = !flat && dots.length > 0 && dots.every((d) => d.misfit > 0);
  return {
    title: `Where the ${result.starts} starts ended`,
    xLabel: 'Minimum (rank, best first)',
    yLabel: 'Final misfit χ² (dimensionless)',
    caption: captionOf(result, notDrawn),
    height: 240,
    build: (P) =>
      ({
        x: { domain: [0.4, n + 0.6], ticks: result.minima.map((_, i) => i + 1), tickFormat: (d: number) => `#${d}` },
        y: flat
          ? { domain: [lo - pad, hi + pad], insetTop: 10 }
          : logScale
            ? { type: 'log', insetTop: 10 }
            : { nice: true, insetTop: 10 },
        symbol: { domain: ['reached', 'short', 'unknown'], range: ['circle', 'triangle', 'circle'] },
        marks: [
          // the selected minimum's column
          P.rectX([selected], { x1: (i: number) => i + 0.55, x2: (i: number) => i + 1.45, fill: 'var(--c-accent-soft)' }),
          P.dot(dots, {
            x: 'x',
            y: 'misfit',
            r: 3.5,
            strokeWidth: 1.2,
            symbol: (d: Dot) => (d.reached === null ? 'unknown' : d.reached ? 'reached' : 'short'),
            fill: (d: Dot) => (d.reached === false ? STOPPED_SHORT : d.reached === null ? 'var(--c-muted)' : REACHED),
            stroke: 'var(--c-surface)',
            title: 'text',
            tip: true,
          }),
        ],
      }) as unknown as Plot.PlotOptions,
  };
}
