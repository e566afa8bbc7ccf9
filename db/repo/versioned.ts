/**
 * Versioned definitions (cavity models, source grids): saving an edit adds
 * version n+1 to the same lineage and never changes a row, so a run that pinned
 * version n keeps what it ran with. One set of queries serves every such table.
 */
import { and, asc, desc, eq, sql } from 'drizzle-orm';
import { getDb } from '../client';
import { cavityModels, sourceGrids } from '../schema/runs';

type VersionedTable = typeof cavityModels | typeof sourceGrids;
type Base = { id: string; networkId: string; lineageId: string; version: number; name: string };

/** The queries over one versioned table; `Row` is its row type, `Fields` what an editor saves. */
export function versionedRepo<Row extends Base, Fields extends object>(table: VersionedTable) {
  // Both tables share the columns used here; the union is narrowed once so drizzle types one query.
  const t = table as typeof cavityModels;
  const insertRow = (values: object) => values as typeof cavityModels.$inferInsert;

  /** First version of a new definition. */
  async function create(networkId: string, userId: string | null, input: Fields): Promise<Row> {
    const [row] = await getDb()
      .insert(t)
      .values(insertRow({ networkId, lineageId: crypto.randomUUID(), version: 1, createdBy: userId, ...input }))
      .returning();
    return row as unknown as Row;
  }

  /** Adds the next version of the lineage of `id`; null when it is not in this network. */
  async function addVersion(networkId: string, id: string, userId: string | null, input: Fields): Promise<Row | null> {
    return getDb().transaction(async (tx) => {
      const [base] = await tx
        .select()
        .from(t)
        .where(and(eq(t.id, id), eq(t.networkId, networkId)));
      if (!base) return null;
      // Lock the lineage so two editors cannot both take the same next number.
      await tx.execute(sql`select pg_advisory_xact_lock(hashtext(${base.lineageId}))`);
      const [{ max }] = await tx
        .select({ max: sql<number>`max(${t.version})` })
        .from(t)
        .where(eq(t.lineageId, base.lineageId));
      const [row] = await tx
        .insert(t)
        .values(insertRow({ networkId, lineageId: base.lineageId, version: Number(max) + 1, createdBy: userId, ...input }))
        .returning();
      return row as unknown as Row;
    });
  }

  async function get(networkId: string, id: string): Promise<Row | null> {
    const [row] = await getDb()
      .select()
      .from(t)
      .where(and(eq(t.id, id), eq(t.networkId, networkId)));
    return (row as unknown as Row) ?? null;
  }

  /** The latest version of every definition of a network, by name. */
  async function list(networkId: string): Promise<(Row & { versions: number })[]> {
    const rows = (await getDb()
      .select()
      .from(t)
      .where(eq(t.networkId, networkId))
      .orderBy(asc(t.lineageId), desc(t.version))) as unknown as Row[];
    const latest = new Map<string, Row & { versions: number }>();
    for (const r of rows) {
      const seen = latest.get(r.lineageId);
      if (seen) seen.versions++;
      else latest.set(r.lineageId, { ...r, versions: 1 });
    }
    return [...latest.values()].sort((a, b) => a.name.localeCompare(b.name));
  }

  /** Every version of the lineage holding `id`, newest first. */
  async function listVersions(networkId: string, id: string): Promise<Row[]> {
    const base = await get(networkId, id);
    if (!base) return [];
    return (await getDb()
      .select()
      .from(t)
      .where(and(eq(t.lineageId, base.lineageId), eq(t.networkId, networkId)))
      .orderBy(desc(t.version))) as unknown as Row[];
  }

  /** Finds a definition by name (latest version), for idempotent seeding. */
  async function findByName(networkId: string, name: string): Promise<Row | null> {
    const [row] = await getDb()
      .select()
      .from(t)
      .where(and(eq(t.networkId, networkId), eq(t.name, name)))
      .orderBy(desc(t.version))
      .limit(1);
    return (row as unknown as Row) ?? null;
  }

  return { create, addVersion, get, list, listVersions, findByName };
}
