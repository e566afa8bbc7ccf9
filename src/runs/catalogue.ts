/**
 * Saving cavity models and source grids: validate, then store a new version.
 * Every problem names its field; nothing stored is changed by a bad edit.
 */
import { gridRepo, type GridRow } from '@/db/repo/grids';
import { modelRepo, type ModelRow } from '@/db/repo/models';
import { record } from '@/src/audit';
import { badRequest, notFound } from '@/src/server/errors';
import { resolveCavity } from '@/src/engine/cavity/resolve';
import { gridProblems, type GridInput } from './grid-spec';
import { settings } from '@/src/settings';
import type { ModelInput } from './model-spec';

export type { GridRow, ModelRow };
export const { get: getGrid, list: listGrids, listVersions: listGridVersions } = gridRepo;
export const { get: getModel, list: listModels, listVersions: listModelVersions } = modelRepo;

function checkModel(input: ModelInput): void {
  try {
    resolveCavity(input.config);
  } catch (e) {
    throw badRequest(`config: ${(e as Error).message}`, 'config');
  }
}

function checkGrid(input: GridInput): void {
  const problems = gridProblems(input, { maxCells: settings().GRID_MAX_CELLS });
  if (problems.length) throw badRequest(`${problems[0].field}: ${problems[0].message}`, problems[0].field);
}

/** A new model or grid is "created"; a next version of one "changed" it. */
function recordSaved(
  networkId: string,
  actorId: string | null,
  subject: 'model' | 'grid',
  row: { id: string; name: string; version: number },
  what: string,
): Promise<void> {
  const action = row.version > 1 ? 'changed' : 'created';
  return record({ networkId, actorId, action, subject, subjectId: row.id, summary: `${what} "${row.name}" v${row.version}` });
}

/** A new model (version 1), or with `baseId` the next version of that model. */
export async function saveModel(networkId: string, userId: string | null, input: ModelInput, baseId?: string): Promise<ModelRow> {
  checkModel(input);
  const fields = { name: input.name, notes: input.notes, config: input.config as unknown as Record<string, unknown> };
  const row = baseId
    ? await modelRepo.addVersion(networkId, baseId, userId, fields)
    : await modelRepo.create(networkId, userId, fields);
  if (!row) throw notFound('That cavity model is not in this network.');
  await recordSaved(networkId, userId, 'model', row, 'cavity model');
  return row;
}

export async function saveGrid(networkId: string, userId: string | null, input: GridInput, baseId?: string): Promise<GridRow> {
  checkGrid(input);
  const regions = input.regions.map((r) =>
    r.kind === 'cells' ? { ...r, cells: [...new Set(r.cells)].sort((a, b) => a - b) } : r,
  );
  const fields = { name: input.name, notes: input.notes, cellSizeDeg: input.cellSizeDeg, regions };
  const row = baseId
    ? await gridRepo.addVersion(networkId, baseId, userId, fields)
    : await gridRepo.create(networkId, userId, fields);
  if (!row) throw notFound('That source grid is not in this network.');
  await recordSaved(networkId, userId, 'grid', row, 'source grid');
  return row;
}
