/**
 * Source grid versions (cell size and named regions). Saving an edit adds
 * version n+1 to the same lineage; a run pins the version it used.
 */
import { sourceGrids } from '../schema/runs';
import { versionedRepo } from './versioned';

export type GridRow = typeof sourceGrids.$inferSelect;
export type GridFields = { name: string; notes: string; cellSizeDeg: number; regions: unknown[] };

export const gridRepo = versionedRepo<GridRow, GridFields>(sourceGrids);
