/**
 * Comments on a run, or on one minimum of one interval of a run. Plain text,
 * length-limited where they are written (src/sharing/comments.ts).
 */
import { sql } from 'drizzle-orm';
import { check, index, integer, pgTable, text, timestamp, uuid } from 'drizzle-orm/pg-core';
import { users } from './auth';
import { networks } from './networks';
import { runs } from './runs';

export const runComments = pgTable(
  'run_comments',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    networkId: uuid('network_id')
      .notNull()
      .references(() => networks.id, { onDelete: 'cascade' }),
    runId: uuid('run_id')
      .notNull()
      .references(() => runs.id, { onDelete: 'cascade' }),
    /** With `minimum`: the comment is on that minimum (0 = best) of the interval starting here. */
    intervalStartsAt: timestamp('interval_starts_at', { withTimezone: true, mode: 'date' }),
    minimum: integer('minimum'),
    authorId: text('author_id').references(() => users.id, { onDelete: 'set null' }),
    body: text('body').notNull(),
    createdAt: timestamp('created_at', { withTimezone: true, mode: 'date' }).notNull().defaultNow(),
  },
  (t) => [
    index('run_comments_run_idx').on(t.runId, t.createdAt),
    check('run_comments_target_ck', sql`(${t.intervalStartsAt} is null) = (${t.minimum} is null)`),
    check('run_comments_minimum_ck', sql`${t.minimum} is null or ${t.minimum} >= 0`),
  ],
);
