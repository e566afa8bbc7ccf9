/**
 * Source grid versions (cell size and named regions). Saving an edit adds
 * version n+1 to the same lineage; a run pins the version it used.
 */
import { and, asc, desc, eq, sql } from 'drizzle-orm';
import { getDb } from '../client';
import { sourceGrids } from '../schema/runs';

export type GridRow = typeof sourceGrids.$inferSelect;
export type GridFields = { name: string; notes: string; cellSizeDeg: number; regions: unknown[] };

/** First version of a new grid. */
export async function createGrid(networkId: string, userId: string | null, input: GridFields): Promise<GridRow> {
  const [row] = await getDb()
    .insert(sourceGrids)
    .values({
      networkId,
      lineageId: crypto.randomUUID(),
      version: 1,
      createdBy: userId,
      ...input,
    })
    .returning();
  return row;
}

/** Adds the next version of the lineage of `gridId`; null when it is not in this network. */
export async function addGridVersion(
  networkId: string,
  gridId: string,
  userId: string | null,
  input: GridFields,
): Promise<GridRow | null> {
  return getDb().transaction(async (tx) => {
    const [base] = await tx
      .select()
      .from(sourceGrids)
      .where(and(eq(sourceGrids.id, gridId), eq(sourceGrids.networkId, networkId)));
    if (!base) return null;
    // Lock the lineage so two editors cannot both take the same next number.
    await tx.execute(sql`select pg_advisory_xact_lock(hashtext(${base.lineageId}))`);
    const [{ max }] = await tx
      .select({ max: sql<number>`max(${sourceGrids.version})` })
      .from(sourceGrids)
      .where(eq(sourceGrids.lineageId, base.lineageId));
    const [row] = await tx
      .insert(sourceGrids)
      .values({
        networkId,
        lineageId: base.lineageId,
        version: Number(max) + 1,
        createdBy: userId,
        ...input,
      })
      .returning();
    return row;
  });
}

export async function getGrid(networkId: string, gridId: string): Promise<GridRow | null> {
  const [row] = await getDb()
    .select()
    .from(sourceGrids)
    .where(and(eq(sourceGrids.id, gridId), eq(sourceGrids.networkId, networkId)));
  return row ?? null;
}

/** The latest version of every grid of a network, by name. */
export async function listGrids(networkId: string): Promise<(GridRow & { versions: number })[]> {
  const rows = await getDb()
    .select()
    .from(sourceGrids)
    .where(eq(sourceGrids.networkId, networkId))
    .orderBy(asc(sourceGrids.lineageId), desc(sourceGrids.version));
  const latest = new Map<string, GridRow & { versions: number }>();
  for (const r of rows) {
    const seen = latest.get(r.lineageId);
    if (seen) seen.versions++;
    else latest.set(r.lineageId, { ...r, versions: 1 });
  }
  return [...latest.values()].sort((a, b) => a.name.localeCompare(b.name));
}

/** Every version of the lineage holding `gridId`, newest first. */
export async function listGridVersions(networkId: string, gridId: string): Promise<GridRow[]> {
  const base = await getGrid(networkId, gridId);
  if (!base) return [];
  return getDb()
    .select()
    .from(sourceGrids)
    .where(and(eq(sourceGrids.lineageId, base.lineageId), eq(sourceGrids.networkId, networkId)))
    .orderBy(desc(sourceGrids.version));
}

/** Finds a grid by name (latest version), for idempotent seeding. */
export async function findGridByName(networkId: string, name: string): Promise<GridRow | null> {
  const [row] = await getDb()
    .select()
    .from(sourceGrids)
    .where(and(eq(sourceGrids.networkId, networkId), eq(sourceGrids.name, name)))
    .orderBy(desc(sourceGrids.version))
    .limit(1);
  return row ?? null;
}
