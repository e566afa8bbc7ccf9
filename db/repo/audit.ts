/** The audit trail's rows: added, and listed newest first. */
import { desc, eq } from 'drizzle-orm';
import { getDb } from '../client';
import { users } from '../schema/auth';
import { auditEntries } from '../schema/audit';

export type AuditEntryRow = typeof auditEntries.$inferSelect;
export type AuditActionName = AuditEntryRow['action'];

export interface NewAuditEntry {
  networkId: string;
  actorId: string | null;
  action: AuditActionName;
  subjectKind: string;
  subjectId: string | null;
  summary: string;
}

/** Adds one entry; the actor's name and e-mail are copied in as they are now. */
export async function insertAuditEntry(e: NewAuditEntry): Promise<AuditEntryRow> {
  const db = getDb();
  const [who] = e.actorId
    ? await db.select({ name: users.name, email: users.email }).from(users).where(eq(users.id, e.actorId))
    : [];
  const actorLabel = who ? `${who.name} <${who.email}>` : '';
  const [row] = await db
    .insert(auditEntries)
    .values({ ...e, actorId: who ? e.actorId : null, actorLabel })
    .returning();
  return row;
}

/** A network's entries, newest first, at most `limit`. */
export async function listAuditEntries(networkId: string, limit: number): Promise<AuditEntryRow[]> {
  return getDb()
    .select()
    .from(auditEntries)
    .where(eq(auditEntries.networkId, networkId))
    .orderBy(desc(auditEntries.at), desc(auditEntries.id))
    .limit(limit);
}
