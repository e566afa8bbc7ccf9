/**
 * Station registry: stations of a network with their installed components and
 * calibrations. Every query is scoped by network id.
 */
import { and, asc, eq, sql } from 'drizzle-orm';
import { getDb } from '../client';
import { stations, stationComponents, intervals, type Calibration, type InterferenceLine } from '../schema/stations';
import { COMPONENTS, type Component } from '@/src/engine/components';

export type StationStatus = 'operating' | 'paused' | 'retired';

export interface StationInput {
  code: string;
  name: string;
  latitude: number;
  longitude: number;
  elevationM: number | null;
  mainsHz: 50 | 60;
  interferenceLines: InterferenceLine[];
  sampleRateHz: number;
  notes: string;
  status: StationStatus;
  components: { component: Component; calibration: Calibration }[];
}

export interface Station extends StationInput {
  id: string;
  networkId: string;
  createdAt: Date;
  updatedAt: Date;
}

export interface StationSummary extends Station {
  intervalCount: number;
  firstIntervalAt: Date | null;
  lastIntervalAt: Date | null;
}

type StationRow = typeof stations.$inferSelect;
type ComponentRow = typeof stationComponents.$inferSelect;

const ORDER: readonly Component[] = COMPONENTS;

function toStation(row: StationRow, comps: ComponentRow[]): Station {
  return {
    ...row,
    mainsHz: row.mainsHz as 50 | 60,
    components: comps
      .filter((c) => c.stationId === row.id)
      .sort((a, b) => ORDER.indexOf(a.component) - ORDER.indexOf(b.component))
      .map((c) => ({ component: c.component, calibration: c.calibration })),
  };
}

function columns(input: StationInput) {
  const { components: _c, ...rest } = input;
  return rest;
}

/** Creates a station and its components in one transaction. Throws on a duplicate code (unique violation). */
export async function createStation(networkId: string, input: StationInput): Promise<Station> {
  return getDb().transaction(async (tx) => {
    const [row] = await tx
      .insert(stations)
      .values({ ...columns(input), networkId })
      .returning();
    const comps = input.components.length
      ? await tx
          .insert(stationComponents)
          .values(input.components.map((c) => ({ stationId: row.id, ...c })))
          .returning()
      : [];
    return toStation(row, comps);
  });
}

/** Replaces a station's fields and its component list; null when not in this network. */
export async function updateStation(networkId: string, stationId: string, input: StationInput): Promise<Station | null> {
  return getDb().transaction(async (tx) => {
    const [row] = await tx
      .update(stations)
      .set({ ...columns(input), updatedAt: new Date() })
      .where(and(eq(stations.id, stationId), eq(stations.networkId, networkId)))
      .returning();
    if (!row) return null;
    await tx.delete(stationComponents).where(eq(stationComponents.stationId, stationId));
    const comps = input.components.length
      ? await tx
          .insert(stationComponents)
          .values(input.components.map((c) => ({ stationId, ...c })))
          .returning()
      : [];
    return toStation(row, comps);
  });
}

export async function getStation(networkId: string, stationId: string): Promise<Station | null> {
  const db = getDb();
  const [row] = await db
    .select()
    .from(stations)
    .where(and(eq(stations.id, stationId), eq(stations.networkId, networkId)));
  if (!row) return null;
  const comps = await db.select().from(stationComponents).where(eq(stationComponents.stationId, row.id));
  return toStation(row, comps);
}

export async function getStationByCode(networkId: string, code: string): Promise<Station | null> {
  const db = getDb();
  const [row] = await db
    .select()
    .from(stations)
    .where(and(eq(stations.code, code), eq(stations.networkId, networkId)));
  if (!row) return null;
  const comps = await db.select().from(stationComponents).where(eq(stationComponents.stationId, row.id));
  return toStation(row, comps);
}

/** All stations of a network by code, with how many intervals each holds and the newest one. */
export async function listStations(networkId: string): Promise<StationSummary[]> {
  const db = getDb();
  const rows = await db.select().from(stations).where(eq(stations.networkId, networkId)).orderBy(asc(stations.code));
  if (rows.length === 0) return [];
  const comps = await db
    .select({ c: stationComponents })
    .from(stationComponents)
    .innerJoin(stations, eq(stations.id, stationComponents.stationId))
    .where(eq(stations.networkId, networkId));
  const counts = await db
    .select({
      stationId: intervals.stationId,
      n: sql<number>`count(*)::int`,
      first: sql<Date | null>`min(${intervals.startsAt})`,
      last: sql<Date | null>`max(${intervals.startsAt})`,
    })
    .from(intervals)
    .where(eq(intervals.networkId, networkId))
    .groupBy(intervals.stationId);
  const byId = new Map(counts.map((c) => [c.stationId, c]));
  const allComps = comps.map((r) => r.c);
  return rows.map((r) => {
    const c = byId.get(r.id);
    return {
      ...toStation(r, allComps),
      intervalCount: c?.n ?? 0,
      firstIntervalAt: c?.first ? new Date(c.first) : null,
      lastIntervalAt: c?.last ? new Date(c.last) : null,
    };
  });
}

/** Deletes a station with its uploads, intervals and tokens; false when not in this network. */
export async function deleteStation(networkId: string, stationId: string): Promise<boolean> {
  const rows = await getDb()
    .delete(stations)
    .where(and(eq(stations.id, stationId), eq(stations.networkId, networkId)))
    .returning({ id: stations.id });
  return rows.length > 0;
}
