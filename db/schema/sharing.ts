/**
 * Read-only links to one run, for people outside the network. The link's token
 * is not stored: it is signed (HMAC) over the link id and its expiry, and
 * checked against this row, which says whether it was revoked.
 */
import { index, pgTable, text, timestamp, uuid } from 'drizzle-orm/pg-core';
import { users } from './auth';
import { networks } from './networks';
import { runs } from './runs';

export const runLinks = pgTable(
  'run_links',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    networkId: uuid('network_id')
      .notNull()
      .references(() => networks.id, { onDelete: 'cascade' }),
    runId: uuid('run_id')
      .notNull()
      .references(() => runs.id, { onDelete: 'cascade' }),
    createdBy: text('created_by').references(() => users.id, { onDelete: 'set null' }),
    createdAt: timestamp('created_at', { withTimezone: true, mode: 'date' }).notNull().defaultNow(),
    expiresAt: timestamp('expires_at', { withTimezone: true, mode: 'date' }).notNull(),
    revokedAt: timestamp('revoked_at', { withTimezone: true, mode: 'date' }),
    revokedBy: text('revoked_by').references(() => users.id, { onDelete: 'set null' }),
  },
  (t) => [index('run_links_run_idx').on(t.runId)],
);
