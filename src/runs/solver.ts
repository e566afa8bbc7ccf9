/**
 * The production interval solver: the engine's multi-start inversion of one
 * interval — log-power spectra, or fitted mode parameters. Threads per run
 * come from CAVITAS_RUN_THREADS (default: the engine's own default, all cores).
 */
import { invertInterval } from '@/src/engine/inverse/invert';
import type { InversionResult } from '@/src/engine/inverse/types';
import { settings } from '@/src/settings';
import { intervalInput } from './interval-input';
import type { IntervalSolver } from './types';
import { seriesMisfits } from './series-misfit';

/**
 * Marks a stored result whose standard errors come from the stated sigmas alone (never scaled by
 * the misfit: the run view scales them when the run asks for it, src/runs/error-scaling.ts).
 */
export const STATED_ERRORS = 'stated' as const;

export function runThreads(): number | undefined {
  return settings().CAVITAS_RUN_THREADS;
}

/** The solver with a fixed thread count (1 = in the calling thread, no pool). */
export function makeEngineSolver(threads?: number): IntervalSolver {
  return (ctx, c, hooks) => solve(ctx, c, hooks, threads ?? runThreads());
}

export const engineSolver: IntervalSolver = (ctx, c, hooks) => solve(ctx, c, hooks, runThreads());

const solve = async (...[ctx, c, hooks, threads]: [...Parameters<IntervalSolver>, number | undefined]) => {
  const { config } = ctx;
  const options = {
    starts: config.starts,
    seed: config.seed,
    ...(threads ? { threads } : {}),
    lm: { initialDamping: config.damping.initialLambda, maxIterations: config.damping.maxIterations },
    scaleErrors: false,
  };
  const callbacks = {
    onProgress: (p: { done: number; total: number }) => hooks.onStart(p.done, p.total),
    shouldCancel: hooks.shouldStop,
  };
  const result = await invertInterval(intervalInput(ctx, c), options, callbacks);
  // A stop asked for while the last starts were finishing leaves a complete result: it is kept.
  if (interrupted(result)) return 'cancelled' as const;
  // Each series' share of the best minimum's chi-square, for the goodness-of-fit tables.
  const best = result.minima[0];
  const misfits = best && Number.isFinite(best.misfit) ? seriesMisfits(ctx, c, best.internal) : undefined;
  return {
    nData: result.nData,
    result: { ...result, errorBasis: STATED_ERRORS, ...(misfits ? { seriesMisfits: misfits } : {}) } as unknown as Record<
      string,
      unknown
    >,
  };
};

/**
 * Whether a stop request cut the inversion short: a start is missing (never begun) or
 * ended by the request (stop reason 'cancelled') instead of by its own criteria.
 */
export function interrupted(result: InversionResult): boolean {
  const ends = result.startEnds;
  if (!ends) return true;
  return ends.index.length < result.starts || ends.stopReason.includes('cancelled');
}
