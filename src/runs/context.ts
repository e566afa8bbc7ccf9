/**
 * Loads what a run needs once: its configuration, the pinned cavity model and
 * source grid versions, and the chosen stations' positions.
 */
import { modelRepo } from '@/db/repo/models';
import { gridRepo } from '@/db/repo/grids';
import { listStations } from '@/db/repo/stations';
import type { RunRow } from '@/db/repo/runs';
import type { CavityConfig } from '@/src/engine/cavity/types';
import { runConfigSchema } from './config';
import { regionSchema } from './grid-spec';
import type { RunContext } from './types';

export async function loadRunContext(run: RunRow): Promise<RunContext> {
  const config = runConfigSchema.parse(run.config);
  const model = await modelRepo.get(run.networkId, run.modelId);
  if (!model) throw new Error('the cavity model version this run pinned no longer exists');
  const grid = await gridRepo.get(run.networkId, run.gridId);
  if (!grid) throw new Error('the source grid version this run pinned no longer exists');
  const wanted = new Set(config.data.stationIds);
  const stations = (await listStations(run.networkId))
    .filter((s) => wanted.has(s.id))
    .map((s) => ({ id: s.id, code: s.code, lat: s.latitude, lon: s.longitude }));
  if (stations.length === 0) throw new Error('none of the chosen stations exists any more');
  return {
    runId: run.id,
    networkId: run.networkId,
    config,
    cavity: model.config as unknown as CavityConfig,
    grid: { cellSizeDeg: grid.cellSizeDeg, regions: grid.regions.map((r) => regionSchema.parse(r)) },
    stations,
  };
}
