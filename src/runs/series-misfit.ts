/**
 * The misfit of each observed series (station and component) at a minimum:
 * the sum of the squares of its weighted residuals in the engine's own
 * least-squares problem, built as the run solver builds it (interval-input.ts).
 * Residuals of different series are independent (any correlation the misfit
 * accounts for lies within one series or one mode), so these add up to the
 * minimum's chi2.
 */
import { buildIntervalProblem } from '@/src/engine/inverse/interval-problem';
import type { SeriesMisfit } from './goodness';
import { intervalInput } from './interval-input';
import type { IntervalObservations } from './observations';
import type { RunContext } from './types';

export function seriesMisfits(ctx: RunContext, obs: IntervalObservations, internal: readonly number[]): SeriesMisfit[] {
  const input = intervalInput(ctx, obs);
  const prepared = buildIntervalProblem(input);
  const r = new Float64Array(prepared.problem.nResiduals);
  prepared.problem.residuals(Float64Array.from(internal), r);
  const blocks: { station: string; component: SeriesMisfit['component']; offset: number; n: number }[] = [];
  if (input.kind === 'modes') {
    let offset = 0;
    for (const s of input.input.modes) {
      blocks.push({ station: s.station, component: s.component, offset, n: 3 * s.modes.length });
      offset += 3 * s.modes.length;
    }
  } else if (prepared.kind === 'spectrum') {
    prepared.layout.series.forEach((s, i) => {
      const o = input.input.observed[i];
      blocks.push({ station: o.station, component: o.component, offset: s.offset, n: s.bins.length });
    });
  }
  return blocks.map((b) => {
    let chi2 = 0;
    for (let k = b.offset; k < b.offset + b.n; k++) chi2 += r[k] * r[k];
    return { station: b.station, component: b.component, chi2, n: b.n };
  });
}
