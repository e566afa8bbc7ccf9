/** Creates a surface row the way the API does, without queueing it (the test computes it directly). */
import { getOrCreateSurface } from '@/db/repo/runs';
import { surfaceKey, type SurfaceSpec } from '@/src/runs/surfaces';

export async function requestSurfaceRow(runId: string, spec: SurfaceSpec): Promise<string> {
  const { row } = await getOrCreateSurface(runId, surfaceKey(spec), spec as unknown as Record<string, unknown>);
  return row.id;
}
