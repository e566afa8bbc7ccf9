/**
 * The local mailbox (mail caught by src/mail/catcher.ts), as each person may see it: everyone
 * reads the messages addressed to their own address in full; administrators also see the
 * envelope of every message (to, subject, time) — never the body of someone else's mail, which
 * may hold a live reset or invitation link.
 */
import { getMail, listMail, countMail, type MailSummary } from '@/db/repo/mail';
import type { User } from '@/src/auth/session';

export interface Envelope {
  id: string;
  to: string[];
  subject: string;
  receivedAt: Date;
  sizeBytes: number;
  /** True when the reader may open the body (the message is addressed to them). */
  own: boolean;
}

export interface MailView extends Envelope {
  from: string;
  /** The plain-text body; null when the reader may see only the envelope. */
  text: string | null;
}

function addressedTo(to: readonly string[], email: string): boolean {
  const me = email.trim().toLowerCase();
  return to.some((a) => a.trim().toLowerCase() === me);
}

function envelope(m: MailSummary, reader: User): Envelope {
  return {
    id: m.id,
    to: m.to,
    subject: m.subject,
    receivedAt: m.receivedAt,
    sizeBytes: m.sizeBytes,
    own: addressedTo(m.to, reader.email),
  };
}

/** The reader's own messages, newest first. */
export async function ownMail(reader: User, limit = 200): Promise<Envelope[]> {
  return (await listMail({ to: reader.email, limit })).map((m) => envelope(m, reader));
}

/** Every caught message's envelope, for administrators (callers check the role), with the total count. */
export async function allEnvelopes(reader: User, limit = 200): Promise<{ envelopes: Envelope[]; total: number }> {
  const [rows, total] = await Promise.all([listMail({ limit }), countMail()]);
  return { envelopes: rows.map((m) => envelope(m, reader)), total };
}

/**
 * One message as `reader` may see it: whole when addressed to them, the envelope alone for an
 * administrator, null (not found) for anyone else.
 */
export async function readMail(reader: User, id: string): Promise<MailView | null> {
  const m = await getMail(id);
  if (!m) return null;
  const own = addressedTo(m.to, reader.email);
  if (!own && !reader.isAdmin) return null;
  return {
    id: m.id,
    from: m.from,
    to: m.to,
    subject: m.subject,
    receivedAt: m.receivedAt,
    sizeBytes: m.sizeBytes,
    own,
    text: own ? (m.text ?? '') : null,
  };
}
