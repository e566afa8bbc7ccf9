/**
 * Misfit surfaces on request: a chi-square map over two free parameters
 * around one minimum of one interval. A request is cached by its spec (run,
 * interval, minimum, parameters, resolution, mode): asking twice returns the
 * same row; the worker fills it in.
 */
import { z } from 'zod';
import { getRun, getOrCreateSurface, getSurface, resetSurface, type SurfaceRow } from '@/db/repo/runs';
import { badRequest, notFound } from '@/src/server/errors';
import { findIntervalView } from './results';
import { enqueueSurface } from './queues';

export const surfaceSpecSchema = z
  .object({
    interval: z.iso.datetime({ offset: true }),
    minimum: z.number().int().min(0).default(0),
    x: z.string().min(1),
    y: z.string().min(1),
    points: z.number().int().min(5).max(41).default(21),
    mode: z.enum(['fixed', 'profile']).default('fixed'),
  })
  .refine((s) => s.x !== s.y, { message: 'choose two different parameters', path: ['y'] });
export type SurfaceSpec = z.infer<typeof surfaceSpecSchema>;

export function surfaceKey(s: SurfaceSpec): string {
  return JSON.stringify([new Date(s.interval).toISOString(), s.minimum, s.x, s.y, s.points, s.mode]);
}

export async function requestSurface(networkId: string, runId: string, spec: SurfaceSpec): Promise<SurfaceRow> {
  const iv = await findIntervalView(networkId, runId, new Date(spec.interval));
  if (!iv || !iv.result) throw badRequest('that interval has no result in this run', 'interval');
  if (!iv.result.minima[spec.minimum]) throw badRequest(`this interval has ${iv.result.minima.length} minima`, 'minimum');
  for (const k of ['x', 'y'] as const) {
    if (!iv.result.paramNames.includes(spec[k]))
      throw badRequest(`"${spec[k]}" is not a free parameter of this run (${iv.result.paramNames.join(', ')})`, k);
  }
  const { row, created } = await getOrCreateSurface(runId, surfaceKey(spec), spec as unknown as Record<string, unknown>);
  if (created || row.state === 'failed') {
    if (!created) await resetSurface(row.id);
    await enqueueSurface(row.id);
    return { ...row, state: 'queued', error: null };
  }
  return row;
}

export async function readSurface(networkId: string, runId: string, surfaceId: string): Promise<SurfaceRow> {
  const run = await getRun(networkId, runId);
  if (!run) throw notFound('That run is not in this network.');
  const row = await getSurface(runId, surfaceId);
  if (!row) throw notFound('No such misfit surface for this run.');
  return row;
}
