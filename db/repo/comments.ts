/** Comments on runs and on minima of runs. */
import { and, asc, eq } from 'drizzle-orm';
import { getDb } from '../client';
import { users } from '../schema/auth';
import { runComments } from '../schema/comments';

export type RunCommentRow = typeof runComments.$inferSelect;
export interface RunCommentEntry extends RunCommentRow {
  authorName: string | null;
}

export async function insertRunComment(c: {
  networkId: string;
  runId: string;
  authorId: string;
  body: string;
  intervalStartsAt: Date | null;
  minimum: number | null;
}): Promise<RunCommentRow> {
  const [row] = await getDb().insert(runComments).values(c).returning();
  return row;
}

/** A run's comments, oldest first, with their authors' names. */
export async function listRunComments(networkId: string, runId: string): Promise<RunCommentEntry[]> {
  const rows = await getDb()
    .select({ c: runComments, authorName: users.name })
    .from(runComments)
    .leftJoin(users, eq(users.id, runComments.authorId))
    .where(and(eq(runComments.networkId, networkId), eq(runComments.runId, runId)))
    .orderBy(asc(runComments.createdAt), asc(runComments.id));
  return rows.map(({ c, authorName }) => ({ ...c, authorName }));
}
