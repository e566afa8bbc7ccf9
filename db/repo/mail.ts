/** Caught outgoing mail: stored by the SMTP catcher, read by the administrators' mailbox. */
import { desc, eq, sql } from 'drizzle-orm';
import { getDb } from '../client';
import { mailMessages, type MailMessage, type NewMailMessage } from '../schema/mail';

export type { MailMessage };
export type MailSummary = Pick<MailMessage, 'id' | 'from' | 'to' | 'subject' | 'receivedAt' | 'sizeBytes'>;

export async function storeMail(message: Omit<NewMailMessage, 'id' | 'receivedAt'>): Promise<MailMessage> {
  const [row] = await getDb().insert(mailMessages).values(message).returning();
  return row;
}

/** Newest first; optionally only messages addressed to `to` (case-insensitive). */
export async function listMail(options: { limit?: number; offset?: number; to?: string } = {}): Promise<MailSummary[]> {
  const limit = Math.min(Math.max(options.limit ?? 50, 1), 500);
  const where = options.to
    ? sql`EXISTS (SELECT 1 FROM jsonb_array_elements_text(${mailMessages.to}) AS r(addr) WHERE lower(r.addr) = lower(${options.to}))`
    : undefined;
  return getDb()
    .select({
      id: mailMessages.id,
      from: mailMessages.from,
      to: mailMessages.to,
      subject: mailMessages.subject,
      receivedAt: mailMessages.receivedAt,
      sizeBytes: mailMessages.sizeBytes,
    })
    .from(mailMessages)
    .where(where)
    .orderBy(desc(mailMessages.receivedAt), desc(mailMessages.id))
    .limit(limit)
    .offset(Math.max(options.offset ?? 0, 0));
}

/** One whole message, or null (also for a malformed id). */
export async function getMail(id: string): Promise<MailMessage | null> {
  if (!/^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i.test(id)) return null;
  const [row] = await getDb().select().from(mailMessages).where(eq(mailMessages.id, id)).limit(1);
  return row ?? null;
}

export async function countMail(): Promise<number> {
  const [row] = await getDb()
    .select({ n: sql<number>`count(*)::int` })
    .from(mailMessages);
  return row.n;
}
