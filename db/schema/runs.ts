/**
 * Cavity models and source grids (both versioned: an edit adds a version, a run
 * pins one), runs with their configuration and progress, one result row per
 * finished interval of a run, and cached misfit surfaces.
 */
import { sql } from 'drizzle-orm';
import {
  pgTable,
  pgEnum,
  uuid,
  text,
  integer,
  doublePrecision,
  jsonb,
  boolean,
  uniqueIndex,
  index,
  check,
  primaryKey,
} from 'drizzle-orm/pg-core';
import { networks } from './networks';
import { at, byUser, createdAt, parent, uuidId } from './columns';

export const runState = pgEnum('run_state', ['queued', 'running', 'paused', 'finished', 'failed', 'cancelled']);
export const surfaceState = pgEnum('surface_state', ['queued', 'running', 'ready', 'failed']);

/**
 * A cavity model version. `lineageId` groups the versions of one model; the row
 * id is what a run pins. `config` is the engine's CavityConfig (plain JSON).
 */
export const cavityModels = pgTable(
  'cavity_models',
  {
    id: uuidId(),
    networkId: parent('network_id', () => networks.id),
    lineageId: uuid('lineage_id').notNull(),
    version: integer('version').notNull(),
    name: text('name').notNull(),
    notes: text('notes').notNull().default(''),
    config: jsonb('config').$type<Record<string, unknown>>().notNull(),
    createdBy: byUser('created_by'),
    createdAt: createdAt(),
  },
  (t) => [
    uniqueIndex('cavity_models_lineage_version_uq').on(t.lineageId, t.version),
    index('cavity_models_network_idx').on(t.networkId),
    check('cavity_models_version_ck', sql`${t.version} >= 1`),
  ],
);

/**
 * A source grid version: the global cell size and the named regions drawn on it
 * (`regions` holds the validated list, see src/runs/grid-spec.ts).
 */
export const sourceGrids = pgTable(
  'source_grids',
  {
    id: uuidId(),
    networkId: parent('network_id', () => networks.id),
    lineageId: uuid('lineage_id').notNull(),
    version: integer('version').notNull(),
    name: text('name').notNull(),
    notes: text('notes').notNull().default(''),
    cellSizeDeg: doublePrecision('cell_size_deg').notNull(),
    regions: jsonb('regions').$type<unknown[]>().notNull(),
    createdBy: byUser('created_by'),
    createdAt: createdAt(),
  },
  (t) => [
    uniqueIndex('source_grids_lineage_version_uq').on(t.lineageId, t.version),
    index('source_grids_network_idx').on(t.networkId),
    check('source_grids_cell_ck', sql`${t.cellSizeDeg} > 0 and ${t.cellSizeDeg} <= 30`),
  ],
);

/** What a run is doing right now, written by the worker as it goes. */
export type RunProgress = {
  phase: string;
  intervalsDone: number;
  intervalsTotal: number;
  startsDone: number;
  startsTotal: number;
  etaSeconds: number | null;
};

export const runs = pgTable(
  'runs',
  {
    id: uuidId(),
    networkId: parent('network_id', () => networks.id),
    name: text('name').notNull(),
    state: runState('state').notNull().default('queued'),
    /** The full launch configuration (src/runs/config.ts RunConfig). */
    config: jsonb('config').$type<Record<string, unknown>>().notNull(),
    modelId: parent('model_id', () => cavityModels.id, 'restrict'),
    gridId: parent('grid_id', () => sourceGrids.id, 'restrict'),
    engineVersion: text('engine_version').notNull(),
    /** The interval start times (ISO) the run covers, fixed at launch. */
    intervalStarts: jsonb('interval_starts').$type<string[]>().notNull(),
    progress: jsonb('progress').$type<RunProgress>().notNull(),
    cancelRequested: boolean('cancel_requested').notNull().default(false),
    error: text('error'),
    attempts: integer('attempts').notNull().default(0),
    workerId: text('worker_id'),
    heartbeatAt: at('heartbeat_at'),
    createdBy: byUser('created_by'),
    createdAt: createdAt(),
    startedAt: at('started_at'),
    finishedAt: at('finished_at'),
  },
  (t) => [index('runs_network_created_idx').on(t.networkId, t.createdAt)],
);

/** One finished interval of a run: its minima (engine result, plain JSON). */
export const runIntervals = pgTable(
  'run_intervals',
  {
    id: uuidId(),
    runId: parent('run_id', () => runs.id),
    startsAt: at('starts_at').notNull(),
    nData: integer('n_data').notNull(),
    result: jsonb('result').$type<Record<string, unknown>>().notNull(),
    seconds: doublePrecision('seconds').notNull(),
    createdAt: createdAt(),
  },
  (t) => [uniqueIndex('run_intervals_run_start_uq').on(t.runId, t.startsAt)],
);

/** A misfit surface over two parameters around one minimum, computed on request and cached by `specKey`. */
export const runSurfaces = pgTable(
  'run_surfaces',
  {
    id: uuidId(),
    runId: parent('run_id', () => runs.id),
    specKey: text('spec_key').notNull(),
    spec: jsonb('spec').$type<Record<string, unknown>>().notNull(),
    state: surfaceState('state').notNull().default('queued'),
    result: jsonb('result').$type<Record<string, unknown>>(),
    error: text('error'),
    createdAt: createdAt(),
    finishedAt: at('finished_at'),
  },
  (t) => [uniqueIndex('run_surfaces_run_spec_uq').on(t.runId, t.specKey)],
);

/**
 * A chunk of a run: a few consecutive intervals (indices `first` … `first + count - 1` of the
 * run's interval starts) that one job solves. Any number of workers hold different chunks of
 * one run at once; a chunk is held by one worker at a time through its heartbeat lease
 * (`workerId`, `heartbeatAt`), and is done once its intervals are stored.
 */
export const runChunks = pgTable(
  'run_chunks',
  {
    first: integer('first_index').notNull(),
    count: integer('count').notNull(),
    runId: parent('run_id', () => runs.id),
    workerId: text('worker_id'),
    heartbeatAt: at('heartbeat_at'),
    attempts: integer('attempts').notNull().default(0),
    doneAt: at('done_at'),
  },
  (t) => [primaryKey({ columns: [t.runId, t.first] }), check('run_chunks_range_ck', sql`${t.first} >= 0 and ${t.count} >= 1`)],
);
