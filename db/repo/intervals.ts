/**
 * Processed 10-minute intervals: one row per station, component and start
 * time, with its spectrum (float8[] arrays, SI units) and its mode fit.
 * Saving is an upsert on (station, component, start), so the same interval
 * sent twice leaves one row; a person's flag survives reprocessing.
 */
import { and, asc, eq, gte, inArray, isNull, lt, sql, type SQL } from 'drizzle-orm';
import { getDb } from '../client';
import { intervals, intervalSpectra, intervalFits, stations, type SpectrumStatistics, type StoredMode } from '../schema/stations';
import type { Component } from '@/src/engine/components';

export type { SpectrumStatistics };

export type IntervalOrigin = 'upload' | 'push' | 'synthetic';

export interface IntervalFit {
  modes: StoredMode[];
  background: { b0: number; b1: number };
  misfit: number;
  /** The band the fit used; absent in fits stored before it was recorded. */
  band?: { minHz: number; maxHz: number };
  /** Equivalent independent averages behind each bin that the errors assume (absent: estimated from the misfit, or not recorded). */
  averages?: number;
  /** Correlation of neighbouring bins' power at distance 1, 2, ... that the errors assume (absent: independent, or not recorded). */
  binCorrelation?: number[];
  /** Frequency ranges whose bins the fit left out, from the first to the last bin of each run ([] when none); absent: not recorded. */
  excluded?: { minHz: number; maxHz: number }[];
}

/** The stored row's fit, leaving out what older rows do not have. */
function fitOf(row: {
  modes: StoredMode[];
  background: { b0: number; b1: number };
  misfit: number;
  band: { minHz: number; maxHz: number } | null;
  averages: number | null;
  binCorrelation: number[] | null;
  excluded: { minHz: number; maxHz: number }[] | null;
}): IntervalFit {
  return {
    modes: row.modes,
    background: row.background,
    misfit: row.misfit,
    ...(row.band ? { band: row.band } : {}),
    ...(row.averages !== null ? { averages: row.averages } : {}),
    ...(row.binCorrelation ? { binCorrelation: row.binCorrelation } : {}),
    ...(row.excluded ? { excluded: row.excluded } : {}),
  };
}

export interface IntervalResultInput {
  networkId: string;
  stationId: string;
  component: Component;
  startsAt: Date;
  durationS: number;
  origin: IntervalOrigin;
  uploadId: string | null;
  rejectedShare: number;
  qualityFlags: string[];
  /** `statistics`: what the spectrum knows of its own scatter (see SpectrumStatistics); null when nothing is known. */
  spectrum: { frequencies: number[]; power: number[]; segments: number; statistics?: SpectrumStatistics | null };
  fit: IntervalFit | null;
  /** Checksum of pushed samples (pushes only). */
  samplesSha256?: string | null;
}

export interface IntervalSummary {
  id: string;
  stationId: string;
  stationCode: string;
  component: Component;
  startsAt: Date;
  durationS: number;
  origin: IntervalOrigin;
  uploadId: string | null;
  rejectedShare: number;
  qualityFlags: string[];
  flagReason: string | null;
  flaggedBy: string | null;
  flaggedAt: Date | null;
  fit: IntervalFit | null;
}

export interface IntervalSpectrum {
  intervalId: string;
  stationId: string;
  stationCode: string;
  component: Component;
  startsAt: Date;
  frequencies: number[];
  power: number[];
  segments: number;
  statistics: SpectrumStatistics | null;
  rejectedShare: number;
}

/**
 * Which intervals: by default unflagged ones only. `includeFlagged` also
 * returns intervals a person flagged; `requireClean` drops intervals carrying
 * any automatic quality flag. `from` inclusive, `to` exclusive (start times).
 */
export interface IntervalFilter {
  networkId: string;
  stationIds?: string[];
  components?: Component[];
  from?: Date;
  to?: Date;
  includeFlagged?: boolean;
  requireClean?: boolean;
  intervalIds?: string[];
  /** At most this many rows (default: all). */
  limit?: number;
}

const BATCH = 400;

/** Saves processed intervals (upsert); returns ids in input order and whether each row is new. */
/** What is stored at one station and start, per component: where it came from and its samples' checksum. */
export async function storedAt(
  stationId: string,
  startsAt: Date,
): Promise<{ component: Component; origin: IntervalOrigin; samplesSha256: string | null }[]> {
  return getDb()
    .select({ component: intervals.component, origin: intervals.origin, samplesSha256: intervals.samplesSha256 })
    .from(intervals)
    .where(and(eq(intervals.stationId, stationId), eq(intervals.startsAt, startsAt)));
}

export async function saveIntervals(items: IntervalResultInput[]): Promise<{ id: string; created: boolean }[]> {
  const out: { id: string; created: boolean }[] = [];
  await getDb().transaction(async (tx) => {
    for (let b = 0; b < items.length; b += BATCH) {
      const batch = items.slice(b, b + BATCH);
      const rows = await tx
        .insert(intervals)
        .values(
          batch.map((i) => ({
            networkId: i.networkId,
            stationId: i.stationId,
            component: i.component,
            startsAt: i.startsAt,
            durationS: i.durationS,
            origin: i.origin,
            uploadId: i.uploadId,
            rejectedShare: i.rejectedShare,
            qualityFlags: i.qualityFlags,
            samplesSha256: i.samplesSha256 ?? null,
          })),
        )
        .onConflictDoUpdate({
          target: [intervals.stationId, intervals.component, intervals.startsAt],
          set: {
            durationS: sql`excluded.duration_s`,
            origin: sql`excluded.origin`,
            uploadId: sql`excluded.upload_id`,
            rejectedShare: sql`excluded.rejected_share`,
            qualityFlags: sql`excluded.quality_flags`,
            samplesSha256: sql`excluded.samples_sha256`,
          },
        })
        .returning({
          id: intervals.id,
          stationId: intervals.stationId,
          component: intervals.component,
          startsAt: intervals.startsAt,
          created: sql<boolean>`(xmax = 0)`,
        });
      const key = (s: string, c: string, t: Date) => `${s}|${c}|${t.getTime()}`;
      const byKey = new Map(rows.map((r) => [key(r.stationId, r.component, new Date(r.startsAt)), r]));
      const ids = batch.map((i) => byKey.get(key(i.stationId, i.component, i.startsAt))!);
      await tx
        .insert(intervalSpectra)
        .values(
          batch.map((i, k) => ({
            intervalId: ids[k].id,
            frequencies: i.spectrum.frequencies,
            power: i.spectrum.power,
            segments: i.spectrum.segments,
            statistics: i.spectrum.statistics ?? null,
          })),
        )
        .onConflictDoUpdate({
          target: intervalSpectra.intervalId,
          set: {
            frequencies: sql`excluded.frequencies`,
            power: sql`excluded.power`,
            segments: sql`excluded.segments`,
            statistics: sql`excluded.statistics`,
          },
        });
      const withFit = batch.map((i, k) => ({ i, id: ids[k].id })).filter((x) => x.i.fit);
      const withoutFit = batch.map((i, k) => ({ i, id: ids[k].id })).filter((x) => !x.i.fit);
      if (withFit.length) {
        await tx
          .insert(intervalFits)
          .values(
            withFit.map(({ i, id }) => {
              const f = i.fit!;
              return {
                intervalId: id,
                modes: f.modes,
                background: f.background,
                misfit: f.misfit,
                band: f.band ?? null,
                averages: f.averages ?? null,
                binCorrelation: f.binCorrelation ?? null,
                excluded: f.excluded ?? null,
              };
            }),
          )
          .onConflictDoUpdate({
            target: intervalFits.intervalId,
            set: {
              modes: sql`excluded.modes`,
              background: sql`excluded.background`,
              misfit: sql`excluded.misfit`,
              band: sql`excluded.band`,
              averages: sql`excluded.averages`,
              binCorrelation: sql`excluded.bin_correlation`,
              excluded: sql`excluded.excluded_ranges`,
            },
          });
      }
      if (withoutFit.length) {
        await tx.delete(intervalFits).where(
          inArray(
            intervalFits.intervalId,
            withoutFit.map((x) => x.id),
          ),
        );
      }
      for (const r of ids) out.push({ id: r.id, created: Boolean(r.created) });
    }
  });
  return out;
}

function where(f: IntervalFilter): SQL {
  const parts: SQL[] = [eq(intervals.networkId, f.networkId)];
  if (f.stationIds) parts.push(f.stationIds.length ? inArray(intervals.stationId, f.stationIds) : sql`false`);
  if (f.components) parts.push(f.components.length ? inArray(intervals.component, f.components) : sql`false`);
  if (f.intervalIds) parts.push(f.intervalIds.length ? inArray(intervals.id, f.intervalIds) : sql`false`);
  if (f.from) parts.push(gte(intervals.startsAt, f.from));
  if (f.to) parts.push(lt(intervals.startsAt, f.to));
  if (!f.includeFlagged) parts.push(isNull(intervals.flagReason));
  if (f.requireClean) parts.push(sql`cardinality(${intervals.qualityFlags}) = 0`);
  return and(...parts)!;
}

/** Series order (station code, component, start): summaries and spectra come back in the same order. */
const SERIES_ORDER = [asc(stations.code), asc(intervals.component), asc(intervals.startsAt)] as const;

/** Interval summaries with their fits (no spectra), ordered by station code, component, start. */
export async function listIntervals(f: IntervalFilter): Promise<IntervalSummary[]> {
  const rows = await getDb()
    .select({ i: intervals, code: stations.code, fit: intervalFits })
    .from(intervals)
    .innerJoin(stations, eq(stations.id, intervals.stationId))
    .leftJoin(intervalFits, eq(intervalFits.intervalId, intervals.id))
    .where(where(f))
    .orderBy(...SERIES_ORDER)
    .limit(f.limit ?? Number.MAX_SAFE_INTEGER);
  return rows.map(({ i, code, fit }) => ({
    id: i.id,
    stationId: i.stationId,
    stationCode: code,
    component: i.component,
    startsAt: i.startsAt,
    durationS: i.durationS,
    origin: i.origin,
    uploadId: i.uploadId,
    rejectedShare: i.rejectedShare,
    qualityFlags: i.qualityFlags,
    flagReason: i.flagReason,
    flaggedBy: i.flaggedBy,
    flaggedAt: i.flaggedAt,
    fit: fit ? fitOf(fit) : null,
  }));
}

/**
 * A float8[] in PostgreSQL's binary array form (what `array_send` gives: ndim, has-nulls flag, element
 * type, then per dimension its length and lower bound, then per element a 4-byte length, -1 for NULL,
 * and the IEEE 754 double big-endian — PostgreSQL docs, array_send in src/backend/utils/adt/arrayfuncs.c).
 * The doubles come back bit for bit, without printing and parsing decimal text on either side.
 */
export function decodeFloat8Array(buf: Uint8Array, column: string): number[] {
  const view = new DataView(buf.buffer, buf.byteOffset, buf.byteLength);
  const bad = (why: string) => new Error(`stored spectrum column ${column}: ${why}`);
  if (buf.byteLength < 12) throw bad(`binary array of ${buf.byteLength} bytes is too short for its header`);
  const ndim = view.getInt32(0);
  if (ndim === 0) return [];
  if (ndim !== 1) throw bad(`expected a one-dimensional array, found ${ndim} dimensions`);
  if (view.getUint32(8) !== FLOAT8_OID)
    throw bad(`expected float8 elements (type ${FLOAT8_OID}), found type ${view.getUint32(8)}`);
  const n = view.getInt32(12);
  const out: number[] = new Array(n);
  let at = 20;
  for (let k = 0; k < n; k++) {
    if (at + 4 > buf.byteLength) throw bad(`binary array ends after ${k} of ${n} elements`);
    const len = view.getInt32(at);
    at += 4;
    if (len === -1) {
      out[k] = null as unknown as number;
      continue;
    } // as the text form reads a NULL element
    if (len !== 8 || at + 8 > buf.byteLength) throw bad(`element ${k} has ${len} bytes, expected 8`);
    out[k] = view.getFloat64(at);
    at += 8;
  }
  return out;
}

const FLOAT8_OID = 701;

/**
 * Spectra (SI units) of the intervals the filter selects, same order as listIntervals. Only the columns a
 * spectrum needs are read, and the two arrays travel in binary form (`array_send`, hex-encoded bytea):
 * turning thousands of doubles into decimal text in the server and parsing it back here cost more CPU
 * than the hex encoding and `decodeFloat8Array`, and gives the same numbers.
 */
export async function getIntervalSpectra(f: IntervalFilter): Promise<IntervalSpectrum[]> {
  const rows = await getDb()
    .select({
      id: intervals.id,
      stationId: intervals.stationId,
      code: stations.code,
      component: intervals.component,
      startsAt: intervals.startsAt,
      rejectedShare: intervals.rejectedShare,
      segments: intervalSpectra.segments,
      statistics: intervalSpectra.statistics,
      // A series' frequencies seldom change from one interval to the next: sent only when they differ
      // from the previous row's (the rows come in series order), reused here otherwise. The comparison is
      // of the binary forms, so the reused array is the row's own bit for bit.
      frequencies: sql<Buffer | null>`case when array_send(${intervalSpectra.frequencies}) = lag(array_send(${intervalSpectra.frequencies})) over (order by ${stations.code}, ${intervals.component}, ${intervals.startsAt}) then null else array_send(${intervalSpectra.frequencies}) end`,
      power: sql<Buffer>`array_send(${intervalSpectra.power})`,
    })
    .from(intervals)
    .innerJoin(stations, eq(stations.id, intervals.stationId))
    .innerJoin(intervalSpectra, eq(intervalSpectra.intervalId, intervals.id))
    .where(where(f))
    .orderBy(...SERIES_ORDER)
    .limit(f.limit ?? Number.MAX_SAFE_INTEGER);
  let previous: number[] = [];
  return rows.map((r) => {
    if (r.frequencies) previous = decodeFloat8Array(r.frequencies, 'frequencies');
    return {
      intervalId: r.id,
      stationId: r.stationId,
      stationCode: r.code,
      component: r.component,
      startsAt: r.startsAt,
      frequencies: r.frequencies ? previous : previous.slice(),
      power: decodeFloat8Array(r.power, 'power'),
      segments: r.segments,
      statistics: r.statistics,
      rejectedShare: r.rejectedShare,
    };
  });
}

/** The statistics stored with each selected spectrum and its number of bins (no arrays), same order as listIntervals. */
export async function listSpectrumStatistics(
  f: IntervalFilter,
): Promise<{ stationCode: string; component: Component; startsAt: Date; bins: number; statistics: SpectrumStatistics | null }[]> {
  return getDb()
    .select({
      stationCode: stations.code,
      component: intervals.component,
      startsAt: intervals.startsAt,
      bins: sql<number>`cardinality(${intervalSpectra.power})`,
      statistics: intervalSpectra.statistics,
    })
    .from(intervals)
    .innerJoin(stations, eq(stations.id, intervals.stationId))
    .innerJoin(intervalSpectra, eq(intervalSpectra.intervalId, intervals.id))
    .where(where(f))
    .orderBy(...SERIES_ORDER)
    .limit(f.limit ?? Number.MAX_SAFE_INTEGER);
}

/** The same spectra through the plain query (the arrays as PostgreSQL's text form), to check getIntervalSpectra against. */
export async function getIntervalSpectraPlain(f: IntervalFilter): Promise<IntervalSpectrum[]> {
  const rows = await getDb()
    .select({ i: intervals, code: stations.code, s: intervalSpectra })
    .from(intervals)
    .innerJoin(stations, eq(stations.id, intervals.stationId))
    .innerJoin(intervalSpectra, eq(intervalSpectra.intervalId, intervals.id))
    .where(where(f))
    .orderBy(...SERIES_ORDER)
    .limit(f.limit ?? Number.MAX_SAFE_INTEGER);
  return rows.map(({ i, code, s }) => ({
    intervalId: i.id,
    stationId: i.stationId,
    stationCode: code,
    component: i.component,
    startsAt: i.startsAt,
    frequencies: s.frequencies,
    power: s.power,
    segments: s.segments,
    statistics: s.statistics,
    rejectedShare: i.rejectedShare,
  }));
}

/** Sets (reason + who) or clears (null) a person's flag; null when the interval is not in this network. */
export async function setIntervalFlag(
  networkId: string,
  intervalId: string,
  flag: { reason: string; userId: string } | null,
): Promise<IntervalSummary | null> {
  const rows = await getDb()
    .update(intervals)
    .set(
      flag
        ? { flagReason: flag.reason, flaggedBy: flag.userId, flaggedAt: new Date() }
        : { flagReason: null, flaggedBy: null, flaggedAt: null },
    )
    .where(and(eq(intervals.id, intervalId), eq(intervals.networkId, networkId)))
    .returning({ id: intervals.id });
  if (!rows.length) return null;
  const [one] = await listIntervals({ networkId, intervalIds: [intervalId], includeFlagged: true });
  return one ?? null;
}

/** Deletes the intervals of one station that start in [from, to); returns how many. */
export async function deleteIntervals(networkId: string, stationId: string, from: Date, to: Date): Promise<number> {
  const rows = await getDb()
    .delete(intervals)
    .where(
      and(
        eq(intervals.networkId, networkId),
        eq(intervals.stationId, stationId),
        gte(intervals.startsAt, from),
        lt(intervals.startsAt, to),
      ),
    )
    .returning({ id: intervals.id });
  return rows.length;
}

/** UTC days (YYYY-MM-DD) on which a station has intervals, newest first. */
export async function listStationDays(networkId: string, stationId: string): Promise<string[]> {
  const rows = await getDb()
    .select({
      day: sql<string>`to_char(${intervals.startsAt} at time zone 'UTC', 'YYYY-MM-DD')`,
    })
    .from(intervals)
    .where(and(eq(intervals.networkId, networkId), eq(intervals.stationId, stationId)))
    .groupBy(sql`1`)
    .orderBy(sql`1 desc`)
    .limit(400);
  return rows.map((r) => r.day);
}

/** Deletes the intervals made from one upload (after its processing failed part-way). */
export async function deleteIntervalsOfUpload(uploadId: string): Promise<number> {
  const rows = await getDb().delete(intervals).where(eq(intervals.uploadId, uploadId)).returning({ id: intervals.id });
  return rows.length;
}
