/**
 * Source grid versions (cell size and named regions). Saving an edit adds
 * version n+1 to the same lineage; a run pins the version it used.
 */
import { sourceGrids } from '../schema/runs';
import { versionedRepo } from './versioned';

export type GridRow = typeof sourceGrids.$inferSelect;
export type GridFields = { name: string; notes: string; cellSizeDeg: number; regions: unknown[] };

const grids = versionedRepo<GridRow, GridFields>(sourceGrids);

export const createGrid = grids.create;
export const addGridVersion = grids.addVersion;
export const getGrid = grids.get;
export const listGrids = grids.list;
export const listGridVersions = grids.listVersions;
export const findGridByName = grids.findByName;
