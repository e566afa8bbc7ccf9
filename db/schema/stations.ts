/**
 * Stations and their data: the registry (stations, installed components with
 * calibration), raw uploads (bytes kept in chunks), 10-minute intervals with
 * their spectra and mode fits, and per-station push tokens.
 */
import { sql } from 'drizzle-orm';
import {
  pgTable,
  pgEnum,
  uuid,
  text,
  doublePrecision,
  integer,
  bigint,
  jsonb,
  real,
  customType,
  uniqueIndex,
  index,
  primaryKey,
  check,
} from 'drizzle-orm/pg-core';
import { COMPONENTS } from '../../src/engine/components';
import { networks } from './networks';
import { at, byUser, createdAt, parent, uuidId } from './columns';
import type { FittedMode } from '../../src/engine/modes/types';

/** Raw bytes (PostgreSQL bytea); postgres.js hands them over as Buffer. */
const bytea = customType<{ data: Buffer; driverData: Buffer }>({
  dataType: () => 'bytea',
});

export const stationComponent = pgEnum('station_component', COMPONENTS);
export const stationStatus = pgEnum('station_status', ['operating', 'paused', 'retired']);
export const uploadFormat = pgEnum('upload_format', ['series-csv', 'spectra-csv', 'series-json']);
export const uploadState = pgEnum('upload_state', ['queued', 'processing', 'done', 'failed']);
export const intervalOrigin = pgEnum('interval_origin', ['upload', 'push', 'synthetic']);

/** One fixed interference line to suppress, besides the mains and its harmonics. */
export type InterferenceLine = { frequencyHz: number; label: string };

/** How raw readings become physical units (V/m for Ez, T for Bns/Bew). */
export type Calibration =
  { kind: 'gain'; gain: number } | { kind: 'response'; points: { frequencyHz: number; amplitude: number; phaseDeg: number }[] };

export const stations = pgTable(
  'stations',
  {
    id: uuidId(),
    networkId: parent('network_id', () => networks.id),
    code: text('code').notNull(),
    name: text('name').notNull(),
    latitude: doublePrecision('latitude').notNull(),
    longitude: doublePrecision('longitude').notNull(),
    elevationM: doublePrecision('elevation_m'),
    mainsHz: integer('mains_hz').notNull().default(50),
    interferenceLines: jsonb('interference_lines').$type<InterferenceLine[]>().notNull().default([]),
    sampleRateHz: doublePrecision('sample_rate_hz').notNull(),
    notes: text('notes').notNull().default(''),
    status: stationStatus('status').notNull().default('operating'),
    createdAt: createdAt(),
    updatedAt: at('updated_at').notNull().defaultNow(),
  },
  (t) => [
    uniqueIndex('stations_network_code_uq').on(t.networkId, t.code),
    check('stations_lat_ck', sql`${t.latitude} between -90 and 90`),
    check('stations_lon_ck', sql`${t.longitude} between -180 and 180`),
    check('stations_mains_ck', sql`${t.mainsHz} in (50, 60)`),
    check('stations_rate_ck', sql`${t.sampleRateHz} > 0`),
  ],
);

export const stationComponents = pgTable(
  'station_components',
  {
    stationId: parent('station_id', () => stations.id),
    component: stationComponent('component').notNull(),
    calibration: jsonb('calibration').$type<Calibration>().notNull(),
  },
  (t) => [primaryKey({ columns: [t.stationId, t.component] })],
);

export const uploads = pgTable(
  'uploads',
  {
    id: uuidId(),
    networkId: parent('network_id', () => networks.id),
    stationId: parent('station_id', () => stations.id),
    uploadedBy: byUser('uploaded_by'),
    fileName: text('file_name').notNull(),
    format: uploadFormat('format').notNull(),
    sizeBytes: bigint('size_bytes', { mode: 'number' }).notNull(),
    sha256: text('sha256').notNull(),
    state: uploadState('state').notNull().default('queued'),
    progress: real('progress').notNull().default(0),
    progressNote: text('progress_note').notNull().default(''),
    error: text('error'),
    attempts: integer('attempts').notNull().default(0),
    intervalCount: integer('interval_count').notNull().default(0),
    /** What the intake noticed but did not refuse (e.g. header keys the layout does not define). */
    warnings: jsonb('warnings').$type<string[]>().notNull().default([]),
    createdAt: createdAt(),
    startedAt: at('started_at'),
    finishedAt: at('finished_at'),
  },
  (t) => [
    uniqueIndex('uploads_network_sha_uq').on(t.networkId, t.sha256),
    index('uploads_station_idx').on(t.stationId, t.createdAt),
  ],
);

export const uploadChunks = pgTable(
  'upload_chunks',
  {
    uploadId: parent('upload_id', () => uploads.id),
    seq: integer('seq').notNull(),
    data: bytea('data').notNull(),
  },
  (t) => [primaryKey({ columns: [t.uploadId, t.seq] })],
);

/** Automatic quality flags of an interval (names from the pipeline) live in `qualityFlags`. */
export const intervals = pgTable(
  'intervals',
  {
    id: uuidId(),
    networkId: parent('network_id', () => networks.id),
    stationId: parent('station_id', () => stations.id),
    component: stationComponent('component').notNull(),
    startsAt: at('starts_at').notNull(),
    durationS: integer('duration_s').notNull().default(600),
    origin: intervalOrigin('origin').notNull(),
    uploadId: uuid('upload_id').references(() => uploads.id, { onDelete: 'set null' }),
    rejectedShare: real('rejected_share').notNull().default(0),
    qualityFlags: text('quality_flags')
      .array()
      .notNull()
      .default(sql`'{}'::text[]`),
    flagReason: text('flag_reason'),
    flaggedBy: byUser('flagged_by'),
    flaggedAt: at('flagged_at'),
    /** SHA-256 of the pushed samples (float64, little-endian; null as NaN); null for other origins. */
    samplesSha256: text('samples_sha256'),
    createdAt: createdAt(),
  },
  (t) => [
    uniqueIndex('intervals_station_component_start_uq').on(t.stationId, t.component, t.startsAt),
    index('intervals_network_start_idx').on(t.networkId, t.startsAt),
  ],
);

/**
 * What a stored spectrum knows about its own scatter, and on what basis:
 * - 'measured': the Welch statistics of the pipeline's own estimate from the samples (the segments actually
 *   averaged after transient rejection, window, overlap, K_eff);
 * - 'from-count': stored before the statistics were kept, samples not kept: K_eff from the stored count of
 *   averaged segments taken as contiguous (the smallest K_eff for that count, so errors are not understated);
 * - 'assumed': a spectrum file, which carries no statistics: 10-s Hann segments at 50 % overlap over the
 *   interval assumed, as its mode fit assumes;
 * - 'log-normal': synthetic spectra made with independent log-normal scatter of the stated sigma of ln P.
 * Null: none recorded; a run refuses such a spectrum, naming it.
 */
export type SpectrumStatistics =
  | {
      basis: 'measured' | 'from-count' | 'assumed';
      welch: { segments: number; window: 'hann'; overlap: number; effectiveAverages: number };
    }
  | { basis: 'log-normal'; sigmaLog: number };

/** One-sided PSD of an interval in SI units ((V/m)^2/Hz for Ez, T^2/Hz for Bns/Bew). */
export const intervalSpectra = pgTable('interval_spectra', {
  intervalId: uuid('interval_id')
    .primaryKey()
    .references(() => intervals.id, { onDelete: 'cascade' }),
  frequencies: doublePrecision('frequencies').array().notNull(),
  power: doublePrecision('power').array().notNull(),
  segments: integer('segments').notNull(),
  statistics: jsonb('statistics').$type<SpectrumStatistics>(),
});

/** A mode as a stored fit keeps it: the engine's fitted mode, plain JSON. */
export type StoredMode = FittedMode;

/**
 * An interval's mode fit. `band` (the fitted band), `averages` (equivalent independent averages behind each
 * bin) and `binCorrelation` (correlation of neighbouring bins' power) say how the fit was made and what its
 * errors assume; `excluded` the frequency ranges it left out (interference lines). Fits stored before they
 * were recorded have them null.
 */
export const intervalFits = pgTable('interval_fits', {
  intervalId: uuid('interval_id')
    .primaryKey()
    .references(() => intervals.id, { onDelete: 'cascade' }),
  modes: jsonb('modes').$type<StoredMode[]>().notNull(),
  background: jsonb('background').$type<{ b0: number; b1: number }>().notNull(),
  misfit: doublePrecision('misfit').notNull(),
  band: jsonb('band').$type<{ minHz: number; maxHz: number }>(),
  averages: doublePrecision('averages'),
  binCorrelation: doublePrecision('bin_correlation').array(),
  /** Frequency ranges whose bins the fit left out (first to last left-out bin of each run; [] when none); null: not recorded. */
  excluded: jsonb('excluded_ranges').$type<{ minHz: number; maxHz: number }[]>(),
});

export const pushTokens = pgTable(
  'push_tokens',
  {
    id: uuidId(),
    networkId: parent('network_id', () => networks.id),
    stationId: parent('station_id', () => stations.id),
    label: text('label').notNull(),
    /** SHA-256 (hex) of the secret; the secret itself is shown once and never stored. */
    secretHash: text('secret_hash').notNull(),
    hint: text('hint').notNull(),
    createdBy: byUser('created_by'),
    createdAt: createdAt(),
    expiresAt: at('expires_at'),
    revokedAt: at('revoked_at'),
    lastUsedAt: at('last_used_at'),
    windowStartedAt: at('window_started_at').notNull().defaultNow(),
    windowCount: integer('window_count').notNull().default(0),
  },
  (t) => [uniqueIndex('push_tokens_secret_uq').on(t.secretHash)],
);
