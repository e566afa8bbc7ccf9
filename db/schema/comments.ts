/**
 * Comments on a run, or on one minimum of one interval of a run. Plain text,
 * length-limited where they are written (src/sharing/comments.ts).
 */
import { sql } from 'drizzle-orm';
import { check, index, integer, pgTable, text } from 'drizzle-orm/pg-core';
import { networks } from './networks';
import { runs } from './runs';
import { at, byUser, createdAt, parent, uuidId } from './columns';

export const runComments = pgTable(
  'run_comments',
  {
    id: uuidId(),
    networkId: parent('network_id', () => networks.id),
    runId: parent('run_id', () => runs.id),
    /** With `minimum`: the comment is on that minimum (0 = best) of the interval starting here. */
    intervalStartsAt: at('interval_starts_at'),
    minimum: integer('minimum'),
    authorId: byUser('author_id'),
    body: text('body').notNull(),
    createdAt: createdAt(),
  },
  (t) => [
    index('run_comments_run_idx').on(t.runId, t.createdAt),
    check('run_comments_target_ck', sql`(${t.intervalStartsAt} is null) = (${t.minimum} is null)`),
    check('run_comments_minimum_ck', sql`${t.minimum} is null or ${t.minimum} >= 0`),
  ],
);
