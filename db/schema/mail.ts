/**
 * Outgoing mail as caught by the local SMTP catcher (src/mail/catcher.ts): every message the
 * app sends on this installation, readable by administrators in the mailbox page.
 */
import { index, pgTable, text, jsonb, integer } from 'drizzle-orm/pg-core';
import { at, uuidId } from './columns';

export const mailMessages = pgTable(
  'mail_messages',
  {
    id: uuidId(),
    /** Envelope sender (MAIL FROM), or the From header when the envelope had none. */
    from: text('from').notNull(),
    /** Envelope recipients (RCPT TO). */
    to: jsonb('to').$type<string[]>().notNull(),
    subject: text('subject').notNull().default(''),
    text: text('text'),
    html: text('html'),
    /** The whole message as received (RFC 5322). */
    raw: text('raw').notNull(),
    sizeBytes: integer('size_bytes').notNull(),
    receivedAt: at('received_at').notNull().defaultNow(),
  },
  (t) => [index('mail_messages_received_idx').on(t.receivedAt)],
);

export type MailMessage = typeof mailMessages.$inferSelect;
export type NewMailMessage = typeof mailMessages.$inferInsert;
