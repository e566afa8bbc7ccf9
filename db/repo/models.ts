/**
 * Cavity model versions. Saving an edit adds version n+1 to the same lineage
 * (rows are never changed), so a run that pinned version n keeps its physics.
 */
import { cavityModels } from '../schema/runs';
import { versionedRepo } from './versioned';

export type ModelRow = typeof cavityModels.$inferSelect;
export type ModelFields = { name: string; notes: string; config: Record<string, unknown> };

export const modelRepo = versionedRepo<ModelRow, ModelFields>(cavityModels);
