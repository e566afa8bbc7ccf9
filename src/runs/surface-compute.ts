/**
 * Computing a cached misfit surface: chi-square over a grid of two free
 * parameters, the others held at the chosen minimum ('fixed') or re-minimised
 * at every point ('profile'), for spectrum and mode-parameter runs alike. The
 * least-squares problem is built as the run solver builds it (interval-input.ts:
 * log-power spectra, or fitted modes on the mode grid), so
 * the surface passes through the stored minimum. The grid spans +-3 standard
 * errors around the minimum (in the internal parameterisation: log intensity,
 * degrees), clipped to the bounds.
 */
import { getRunById, getSurfaceById, listRunIntervals, setSurface } from '@/db/repo/runs';
import { buildIntervalProblem } from '@/src/engine/inverse/interval-problem';
import { misfitSurface } from '@/src/engine/inverse/surface';
import type { InversionResult, MisfitSurface } from '@/src/engine/inverse/types';
import { loadRunContext } from './context';
import { intervalInput } from './interval-input';
import { loadIntervalObservations } from './observations';
import type { SurfaceSpec } from './surfaces';

const SPAN_SIGMAS = 3;

function axis(centre: number, sigma: number, lo: number, hi: number, n: number): number[] {
  const half = Number.isFinite(sigma) && sigma > 0 ? SPAN_SIGMAS * sigma : Math.max(1e-3, 0.1 * (hi - lo));
  const a = Math.max(lo, centre - half);
  const b = Math.min(hi, centre + half);
  return Array.from({ length: n }, (_, i) => a + ((b - a) * i) / (n - 1));
}

export async function computeSurface(surfaceId: string): Promise<'ready' | 'failed' | 'gone'> {
  const row = await getSurfaceById(surfaceId);
  if (!row) return 'gone';
  if (row.state === 'ready') return 'ready';
  await setSurface(surfaceId, 'running');
  try {
    const spec = row.spec as unknown as SurfaceSpec;
    const run = await getRunById(row.runId);
    if (!run) return 'gone';
    const ctx = await loadRunContext(run);
    const iv = (await listRunIntervals(run.id)).find((r) => r.startsAt.toISOString() === new Date(spec.interval).toISOString());
    const result = iv?.result as unknown as InversionResult | undefined;
    const minimum = result?.minima?.[spec.minimum];
    if (!result || !minimum) throw new Error('the interval or minimum has no stored result');
    const obs = await loadIntervalObservations(ctx.networkId, ctx.config, new Date(spec.interval));
    if (obs.modes && obs.modes.length === 0) throw new Error('this interval has no stored mode fits any more');
    const { problem, par } = buildIntervalProblem(intervalInput(ctx, obs));
    const ix = par.names.indexOf(spec.x);
    const iy = par.names.indexOf(spec.y);
    if (ix < 0 || iy < 0) throw new Error(`unknown parameter ${ix < 0 ? spec.x : spec.y}`);
    const p0 = Float64Array.from(minimum.internal);
    const sigmaOf = (i: number) => {
      const slot = par.slots[i];
      const e = minimum.stdErrors[par.regions[slot.region].name]?.[slot.kind];
      if (e === undefined) return NaN;
      return slot.kind === 'intensity' ? e / Math.exp(p0[i]) : e;
    };
    const phys = (i: number, v: number) => (par.slots[i].kind === 'intensity' ? Math.exp(v) : v);
    const xs = axis(p0[ix], sigmaOf(ix), par.lower[ix], par.upper[ix], spec.points).map((v) => phys(ix, v));
    const ys = axis(p0[iy], sigmaOf(iy), par.lower[iy], par.upper[iy], spec.points).map((v) => phys(iy, v));
    const computed = misfitSurface(problem, par, {
      xName: spec.x,
      yName: spec.y,
      x: xs,
      y: ys,
      mode: spec.mode,
      at: minimum.internal,
    });
    const surface: MisfitSurface & { centre: { x: number; y: number; misfit: number } } = {
      ...computed,
      centre: { x: phys(ix, p0[ix]), y: phys(iy, p0[iy]), misfit: minimum.misfit },
    };
    await setSurface(surfaceId, 'ready', surface as unknown as Record<string, unknown>);
    return 'ready';
  } catch (e) {
    await setSurface(surfaceId, 'failed', null, e instanceof Error ? e.message : String(e));
    return 'failed';
  }
}
