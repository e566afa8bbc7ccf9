/**
 * Each start's own end in the multi-start result: its final misfit is the
 * chi-square (sum of ((ln P_pred - ln P_obs) / sigma)^2, the log-power misfit
 * of Press et al., Numerical Recipes 3rd ed. §15.1) at the start's final
 * parameters, here recomputed with the table-free forward model (Legendre
 * functions evaluated directly, not the inverter's kernel tables); each
 * minimum's misfit is the smallest of its starts'; the bookkeeping columns
 * agree with the minima. Also the grouping rule for starts that stopped
 * without converging but ended lower than the minimum nearest to them.
 */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { invertCaseSchema, type CaseFile } from '@/src/engine/case';
import { predictSpectraDirect } from '@/src/engine/forward/direct-spectra';
import { inputFromCase } from '@/src/engine/case/spectrum-input';
import { groupMinima, type FinishedStart } from '@/src/engine/inverse/grouping';
import { invertSpectra } from '@/src/engine/inverse/invert';
import { resolveMultiStartOptions } from '@/src/engine/inverse/multistart-options';
import { runStarts } from '@/src/engine/inverse/descents';
import { CLUSTER_MIN_ITERATIONS } from '@/src/engine/tolerances';
import { prepareSpectrum } from '@/src/engine/inverse/interval-problem';
import type { InversionResult } from '@/src/engine/inverse/types';
import { CONVERGED_REASONS } from '@/src/engine/optim/types';

const c: CaseFile = invertCaseSchema.parse(JSON.parse(readFileSync('fixtures/cases/two-minima.json', 'utf8')));
const input = inputFromCase(c);

/** chi-square of the case's observations for one internal vector [ln I, lat, lon] of R1, by the direct forward model. */
function directMisfit(x: Float64Array): number {
  const [lnI, lat, lon] = x;
  const spectra = predictSpectraDirect({
    cavity: c.cavity,
    band: c.band,
    stations: c.stations,
    sources: [{ name: 'R1', lat, lon, intensity: Math.exp(lnI) }],
  });
  let chi2 = 0;
  for (const o of c.observed ?? []) {
    const s = spectra.find((p) => p.station === o.station && p.component === o.component)!;
    o.frequencies.forEach((f, i) => {
      const j = s.frequencies.findIndex((g) => Math.abs(g - f) < 1e-9);
      const r = (Math.log(s.power[j]) - Math.log(o.power[i])) / o.sigmaLog!;
      chi2 += r * r;
    });
  }
  return chi2;
}

function checkBookkeeping(res: InversionResult) {
  const ends = res.startEnds!;
  expect(ends.index).toEqual(Array.from({ length: res.starts }, (_, i) => i));
  for (const col of [ends.misfit, ends.iterations, ends.stopReason, ends.minimum]) expect(col).toHaveLength(res.starts);
  res.minima.forEach((m, rank) => {
    const mine = m.startIndexes.map((s) => ends.misfit[s]).filter((v): v is number => v !== null);
    // the minimum's misfit is the smallest final misfit among the starts counted in it
    expect(m.misfit).toBe(Math.min(...mine));
    for (const s of m.startIndexes) expect(ends.minimum[s]).toBe(rank);
    const reasons: Record<string, number> = {};
    for (const s of m.startIndexes) reasons[ends.stopReason[s]] = (reasons[ends.stopReason[s]] ?? 0) + 1;
    expect(reasons).toEqual(m.stopReasons);
  });
  const searchedShort = ends.stopReason.filter((r) => r !== 'clustered' && !CONVERGED_REASONS.includes(r));
  expect(searchedShort.length).toBe(res.unconverged);
}

describe('each start keeps its own end', () => {
  for (const [label, lm] of [
    ['converged starts', {}],
    ['starts cut short at 3 iterations', { maxIterations: 3 }],
  ] as const) {
    it(`final misfits are the misfit at each start's final parameters (${label})`, async () => {
      const options = { starts: 10, seed: 4, threads: 1, lm };
      const res = await invertSpectra(input, options);
      checkBookkeeping(res);
      // The same starts again (start i depends only on seed and i), for their final parameters.
      const o = resolveMultiStartOptions(options);
      const { problem } = prepareSpectrum(input);
      const again = runStarts(
        problem,
        Array.from({ length: 10 }, (_, i) => i),
        { seed: o.seed, warm: o.warm, lm: o.lm },
      );
      for (const a of again) {
        const own = res.startEnds!.misfit[a.index]!;
        if (res.startEnds!.stopReason[a.index] === 'clustered') {
          // stopped early near a minimum an earlier wave found (clustering.ts): no lower than that minimum
          const counted = res.minima[res.startEnds!.minimum[a.index]];
          expect(own).toBeGreaterThanOrEqual(counted.misfit);
          expect(res.startEnds!.iterations[a.index]).toBeGreaterThanOrEqual(CLUSTER_MIN_ITERATIONS);
          continue;
        }
        const direct = directMisfit(a.params);
        // kernel tables agree with the direct Legendre evaluation to about 1e-4 in ln P
        expect(Math.abs(own - direct) / direct).toBeLessThan(1e-2);
        expect(res.startEnds!.iterations[a.index]).toBe(a.iterations);
        expect(res.startEnds!.stopReason[a.index]).toBe(a.stopReason);
      }
      if (label !== 'converged starts') expect(res.unconverged).toBeGreaterThan(0);
    });
  }
});

describe('grouping of starts that did not converge', () => {
  const bounds = { lower: Float64Array.from([0]), upper: Float64Array.from([10]) };
  const start = (index: number, x: number, chi2: number, converged: boolean): FinishedStart => ({
    index,
    params: Float64Array.from([x]),
    chi2,
    converged,
  });

  it('joins the nearest minimum when it ended at or above its misfit', () => {
    const g = groupMinima([start(0, 2, 10, true), start(1, 2.5, 12, false), start(2, 8, 20, true)], bounds);
    expect(g.map((x) => x.members.map((m) => m.index))).toEqual([[0, 1], [2]]);
  });

  it('becomes the best point of the same minimum when it ended slightly lower there', () => {
    const g = groupMinima([start(0, 2, 10, true), start(1, 2.001, 10 - 1e-6, false)], bounds);
    expect(g).toHaveLength(1);
    expect(g[0].best.index).toBe(1);
  });

  it('opens a minimum of its own, ranked by misfit, when it ended lower somewhere else', () => {
    const g = groupMinima([start(0, 2, 10, true), start(1, 4, 5, false), start(2, 7, NaN, false)], bounds);
    expect(g.map((x) => x.best.index)).toEqual([1, 0]);
    // a start without a finite misfit is counted with the worst minimum
    expect(g[1].members.map((m) => m.index)).toEqual([0, 2]);
  });
});
