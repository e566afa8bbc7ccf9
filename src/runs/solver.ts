/**
 * The production interval solver: the engine's multi-start spectrum
 * inversion on one interval's observations. Threads per run come from
 * CAVITAS_RUN_THREADS (default: the engine's own default, all cores).
 */
import { invertSpectra } from '@/src/engine/inverse/invert';
import type { IntervalSolver } from './types';
import { buildUnknowns } from './unknowns';

export function runThreads(): number | undefined {
  const t = Number(process.env.CAVITAS_RUN_THREADS);
  return Number.isInteger(t) && t >= 1 ? t : undefined;
}

export const engineSolver: IntervalSolver = async (ctx, c, hooks) => {
  const { config } = ctx;
  const result = await invertSpectra(
    {
      cavity: ctx.cavity,
      stations: ctx.stations.map((s) => ({ code: s.code, lat: s.lat, lon: s.lon })),
      observed: c.observed,
      unknowns: buildUnknowns(config, ctx.grid),
    },
    {
      starts: config.starts,
      seed: config.seed,
      ...(runThreads() ? { threads: runThreads() } : {}),
      lm: { initialDamping: config.damping.initialLambda, maxIterations: config.damping.maxIterations },
      scaleErrors: config.damping.scaleCovariance,
    },
    { onProgress: (p) => hooks.onStart(p.done, p.total), shouldCancel: hooks.shouldStop },
  );
  if (hooks.shouldStop()) return 'cancelled';
  return { nData: result.nData, result: result as unknown as Record<string, unknown> };
};
