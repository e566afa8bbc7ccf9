/**
 * The network's audit trail: who created, changed, shared, exported, imported
 * or deleted what, and when. Rows are only ever added (src/audit); the
 * actor's name is kept as written at the time, so an entry still says who
 * even after the account is gone.
 */
import { index, pgEnum, pgTable, text, timestamp, uuid } from 'drizzle-orm/pg-core';
import { users } from './auth';
import { networks } from './networks';

export const auditAction = pgEnum('audit_action', ['created', 'changed', 'shared', 'exported', 'imported', 'deleted']);

export const auditEntries = pgTable(
  'audit_entries',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    at: timestamp('at', { withTimezone: true, mode: 'date' }).notNull().defaultNow(),
    networkId: uuid('network_id')
      .notNull()
      .references(() => networks.id, { onDelete: 'cascade' }),
    action: auditAction('action').notNull(),
    /** What kind of thing: run, link, comment, model, grid, station, member. */
    subjectKind: text('subject_kind').notNull(),
    subjectId: text('subject_id'),
    actorId: text('actor_id').references(() => users.id, { onDelete: 'set null' }),
    /** The actor's name and e-mail when the entry was written (empty for the system). */
    actorLabel: text('actor_label').notNull(),
    /** One line naming the thing and what happened to it. */
    summary: text('summary').notNull(),
  },
  (t) => [index('audit_entries_network_idx').on(t.networkId, t.at)],
);
