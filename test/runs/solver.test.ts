/**
 * The engine solver's answer to a stop request: a solve the stop cut short says
 * 'cancelled'; one whose starts had all ended on their own criteria when the stop
 * came is complete and keeps its result (the run driver stores it).
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { closeDatabase, resetDatabase } from '@/test/helpers/db';
import { loadRunContext } from '@/src/runs/context';
import { loadIntervalObservations } from '@/src/runs/observations';
import { engineSolver, interrupted } from '@/src/runs/solver';
import type { InversionResult } from '@/src/engine/inverse/types';
import { makeRunWorld, newRun } from './world';

process.env.CAVITAS_RUN_THREADS = '1';

async function oneInterval() {
  const w = await makeRunWorld(1);
  const run = await newRun(w);
  const ctx = await loadRunContext(run);
  const startsAt = run.intervalStarts[0];
  return {
    ctx,
    c: { startsAt, ...(await loadIntervalObservations(w.networkId, w.config, new Date(startsAt))) },
    starts: w.config.starts,
  };
}

describe('engine solver and stop requests', () => {
  beforeAll(resetDatabase);
  afterAll(closeDatabase);

  it('keeps a solve whose starts all ended before the stop came, and drops one the stop cut short', async () => {
    const { ctx, c, starts } = await oneInterval();
    // The stop is asked for once the last start has reported: every start ended on its own.
    let done = 0;
    const late = await engineSolver(ctx, c, {
      onStart: (d) => {
        done = d;
      },
      shouldStop: () => done >= starts,
    });
    expect(late).not.toBe('cancelled');
    const result = (late as { result: Record<string, unknown> }).result as unknown as InversionResult;
    expect(result.startEnds!.index).toHaveLength(starts);
    expect(result.startEnds!.stopReason).not.toContain('cancelled');
    expect(interrupted(result)).toBe(false);

    // The stop is asked for after the first start: the rest end at once with stop reason 'cancelled'.
    done = 0;
    const early = await engineSolver(ctx, c, {
      onStart: (d) => {
        done = d;
      },
      shouldStop: () => done >= 1,
    });
    expect(early).toBe('cancelled');
  });

  it("records each series' chi2 at the best minimum (adding up to its misfit) and errors as stated", async () => {
    const { ctx, c } = await oneInterval();
    const out = await engineSolver(ctx, { ...c }, { onStart: () => {}, shouldStop: () => false });
    const result = (out as { result: Record<string, unknown> }).result as unknown as InversionResult & {
      seriesMisfits: { station: string; component: string; chi2: number; n: number }[];
      errorBasis: string;
    };
    expect(result.errorBasis).toBe('stated');
    expect(result.seriesMisfits.map((s) => `${s.station} ${s.component}`)).toEqual(
      c.observed.map((o) => `${o.station} ${o.component}`),
    );
    expect(result.seriesMisfits.reduce((a, s) => a + s.n, 0)).toBe(result.nData);
    const best = result.minima[0];
    expect(result.seriesMisfits.reduce((a, s) => a + s.chi2, 0)).toBeCloseTo(best.misfit, 6);
    // Errors from the stated sigmas: the run world does not scale them, whatever its chi2.
    expect(ctx.config.scaleErrorsByMisfit ?? false).toBe(false);
  });

  it('calls a result interrupted when a start is missing or was ended by the stop', () => {
    const base = {
      starts: 3,
      startEnds: {
        index: [0, 1, 2],
        misfit: [1, 2, 3],
        iterations: [4, 4, 4],
        stopReason: ['misfit-change', 'step-size', 'gradient'],
        minimum: [0, 0, 1],
      },
    };
    expect(interrupted(base as unknown as InversionResult)).toBe(false);
    expect(
      interrupted({
        ...base,
        startEnds: { ...base.startEnds, stopReason: ['misfit-change', 'cancelled', 'gradient'] },
      } as unknown as InversionResult),
    ).toBe(true);
    expect(interrupted({ ...base, starts: 4 } as unknown as InversionResult)).toBe(true);
    expect(interrupted({ starts: 3 } as unknown as InversionResult)).toBe(true); // no record of how the starts ended
  });
});
