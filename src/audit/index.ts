/**
 * The audit trail: the domain modules call `record` where they create,
 * change, share, export, import or delete something of a network; owners read
 * the entries (newest first) on the network's audit page or as CSV. Writing
 * an entry never stops the work it records: a failure is logged and the work
 * stands.
 */
import { insertAuditEntry, listAuditEntries, type AuditActionName, type AuditEntryRow } from '@/db/repo/audit';
import { toCsv } from '@/src/runs/results';

export type AuditAction = AuditActionName;
export type AuditSubject = 'run' | 'link' | 'comment' | 'model' | 'grid' | 'station' | 'member';

export interface AuditEvent {
  networkId: string;
  /** The signed-in user who did it; null for the system (worker, seeding). */
  actorId: string | null;
  action: AuditAction;
  subject: AuditSubject;
  subjectId: string | null;
  /** One line naming the thing and what happened, e.g. `run "Night belt" (12 intervals)`. */
  summary: string;
}

/** How many entries the page shows, and the most one CSV export carries. */
export const AUDIT_PAGE_ROWS = 200;
export const AUDIT_EXPORT_ROWS = 50_000;

export async function record(e: AuditEvent): Promise<void> {
  try {
    await insertAuditEntry({
      networkId: e.networkId,
      actorId: e.actorId,
      action: e.action,
      subjectKind: e.subject,
      subjectId: e.subjectId,
      summary: e.summary.slice(0, 500),
    });
  } catch (err) {
    console.error(`audit: could not record ${e.action} ${e.subject} ${e.subjectId ?? ''}: ${(err as Error).message}`);
  }
}

export interface AuditEntry {
  at: string;
  actor: string;
  action: AuditAction;
  subject: string;
  subjectId: string | null;
  summary: string;
}

function view(r: AuditEntryRow): AuditEntry {
  return {
    at: r.at.toISOString(),
    actor: r.actorLabel || 'Cavitas (system)',
    action: r.action,
    subject: r.subjectKind,
    subjectId: r.subjectId,
    summary: r.summary,
  };
}

export async function auditTrail(networkId: string, limit = AUDIT_PAGE_ROWS): Promise<AuditEntry[]> {
  return (await listAuditEntries(networkId, limit)).map(view);
}

/**
 * A spreadsheet would run a cell that starts with = + - @ (or a tab/return) as a formula: such
 * text is written with a leading apostrophe (OWASP, "CSV Injection" — common practice).
 */
function inert(s: string): string {
  return /^[=+\-@\t\r]/.test(s) ? `'${s}` : s;
}

/** The whole trail (up to AUDIT_EXPORT_ROWS, newest first) as CSV, times in UTC. */
export async function auditCsv(networkId: string): Promise<string> {
  const rows = await auditTrail(networkId, AUDIT_EXPORT_ROWS);
  if (!rows.length) return 'at_utc,actor,action,subject,subject_id,summary\n';
  return toCsv(
    rows.map((r) => ({
      at_utc: r.at,
      actor: inert(r.actor),
      action: r.action,
      subject: r.subject,
      subject_id: r.subjectId ?? '',
      summary: inert(r.summary),
    })),
  );
}
