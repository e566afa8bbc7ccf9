/**
 * Cavity model versions. Saving an edit adds version n+1 to the same lineage
 * (rows are never changed), so a run that pinned version n keeps its physics.
 */
import { and, asc, desc, eq, sql } from 'drizzle-orm';
import { getDb } from '../client';
import { cavityModels } from '../schema/runs';

export type ModelRow = typeof cavityModels.$inferSelect;
export type ModelFields = { name: string; notes: string; config: Record<string, unknown> };

/** First version of a new model. */
export async function createModel(networkId: string, userId: string | null, input: ModelFields): Promise<ModelRow> {
  const [row] = await getDb()
    .insert(cavityModels)
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

/** Adds the next version of the lineage of `modelId`; null when it is not in this network. */
export async function addModelVersion(
  networkId: string,
  modelId: string,
  userId: string | null,
  input: ModelFields,
): Promise<ModelRow | null> {
  return getDb().transaction(async (tx) => {
    const [base] = await tx
      .select()
      .from(cavityModels)
      .where(and(eq(cavityModels.id, modelId), eq(cavityModels.networkId, networkId)));
    if (!base) return null;
    // Lock the lineage so two editors cannot both take the same next number.
    await tx.execute(sql`select pg_advisory_xact_lock(hashtext(${base.lineageId}))`);
    const [{ max }] = await tx
      .select({ max: sql<number>`max(${cavityModels.version})` })
      .from(cavityModels)
      .where(eq(cavityModels.lineageId, base.lineageId));
    const [row] = await tx
      .insert(cavityModels)
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

export async function getModel(networkId: string, modelId: string): Promise<ModelRow | null> {
  const [row] = await getDb()
    .select()
    .from(cavityModels)
    .where(and(eq(cavityModels.id, modelId), eq(cavityModels.networkId, networkId)));
  return row ?? null;
}

/** The latest version of every model of a network, by name. */
export async function listModels(networkId: string): Promise<(ModelRow & { versions: number })[]> {
  const rows = await getDb()
    .select()
    .from(cavityModels)
    .where(eq(cavityModels.networkId, networkId))
    .orderBy(asc(cavityModels.lineageId), desc(cavityModels.version));
  const latest = new Map<string, ModelRow & { versions: number }>();
  for (const r of rows) {
    const seen = latest.get(r.lineageId);
    if (seen) seen.versions++;
    else latest.set(r.lineageId, { ...r, versions: 1 });
  }
  return [...latest.values()].sort((a, b) => a.name.localeCompare(b.name));
}

/** Every version of the lineage holding `modelId`, newest first. */
export async function listModelVersions(networkId: string, modelId: string): Promise<ModelRow[]> {
  const base = await getModel(networkId, modelId);
  if (!base) return [];
  return getDb()
    .select()
    .from(cavityModels)
    .where(and(eq(cavityModels.lineageId, base.lineageId), eq(cavityModels.networkId, networkId)))
    .orderBy(desc(cavityModels.version));
}

/** Finds a model by name (latest version), for idempotent seeding. */
export async function findModelByName(networkId: string, name: string): Promise<ModelRow | null> {
  const [row] = await getDb()
    .select()
    .from(cavityModels)
    .where(and(eq(cavityModels.networkId, networkId), eq(cavityModels.name, name)))
    .orderBy(desc(cavityModels.version))
    .limit(1);
  return row ?? null;
}
