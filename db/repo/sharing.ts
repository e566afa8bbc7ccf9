/** Read-only run links: stored, listed with their creator, revoked. */
import { and, desc, eq, isNull } from 'drizzle-orm';
import { alias } from 'drizzle-orm/pg-core';
import { getDb } from '../client';
import { users } from '../schema/auth';
import { runLinks } from '../schema/sharing';

export type RunLinkRow = typeof runLinks.$inferSelect;

export interface RunLinkEntry extends RunLinkRow {
  createdByName: string | null;
  revokedByName: string | null;
}

export async function insertRunLink(l: {
  networkId: string;
  runId: string;
  createdBy: string;
  expiresAt: Date;
}): Promise<RunLinkRow> {
  const [row] = await getDb().insert(runLinks).values(l).returning();
  return row;
}

export async function getRunLink(linkId: string): Promise<RunLinkRow | null> {
  const [row] = await getDb().select().from(runLinks).where(eq(runLinks.id, linkId));
  return row ?? null;
}

export async function listRunLinks(networkId: string, runId: string): Promise<RunLinkEntry[]> {
  const creator = alias(users, 'creator');
  const revoker = alias(users, 'revoker');
  const rows = await getDb()
    .select({ l: runLinks, createdByName: creator.name, revokedByName: revoker.name })
    .from(runLinks)
    .leftJoin(creator, eq(creator.id, runLinks.createdBy))
    .leftJoin(revoker, eq(revoker.id, runLinks.revokedBy))
    .where(and(eq(runLinks.networkId, networkId), eq(runLinks.runId, runId)))
    .orderBy(desc(runLinks.createdAt));
  return rows.map(({ l, createdByName, revokedByName }) => ({ ...l, createdByName, revokedByName }));
}

/** Marks the link revoked (once); null when there is no such link on this run. */
export async function revokeRunLink(
  networkId: string,
  runId: string,
  linkId: string,
  userId: string,
): Promise<RunLinkRow | null> {
  const db = getDb();
  const where = and(eq(runLinks.id, linkId), eq(runLinks.networkId, networkId), eq(runLinks.runId, runId));
  const [row] = await db
    .update(runLinks)
    .set({ revokedAt: new Date(), revokedBy: userId })
    .where(and(where, isNull(runLinks.revokedAt)))
    .returning();
  if (row) return row;
  const [existing] = await db.select().from(runLinks).where(where);
  return existing ?? null;
}
