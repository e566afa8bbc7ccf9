/**
 * Comments on a run or on one minimum of one of its intervals: plain text
 * (shown as text, never as markup), at most MAX_COMMENT_CHARS characters,
 * with author and time. Members write them; link holders read them.
 */
import { record } from '@/src/audit';
import { z } from 'zod';
import { getRun, getRunInterval } from '@/db/repo/runs';
import { insertRunComment, listRunComments, type RunCommentEntry } from '@/db/repo/comments';
import { badRequest, notFound } from '@/src/server/errors';
import { requireLink } from './links';

export const MAX_COMMENT_CHARS = 2000;

export const newCommentSchema = z
  .object({
    body: z
      .string({ error: 'body must be text' })
      .trim()
      .min(1, 'write something first')
      .max(MAX_COMMENT_CHARS, `keep a comment to ${MAX_COMMENT_CHARS} characters`),
    /** With `minimum`: comment on that minimum (0 = best) of the interval starting at this time. */
    interval: z.iso.datetime({ offset: true, error: 'interval must be an interval start time (ISO 8601)' }).optional(),
    minimum: z.number().int().min(0).max(10_000).optional(),
  })
  .refine((c) => (c.interval === undefined) === (c.minimum === undefined), {
    message: 'name both the interval and the minimum, or neither (a comment on the whole run)',
    path: ['minimum'],
  });
export type NewComment = z.infer<typeof newCommentSchema>;

export interface CommentView {
  id: string;
  author: string | null;
  body: string;
  createdAt: string;
  /** Null: on the whole run. */
  on: { interval: string; minimum: number } | null;
}

function viewOf(c: RunCommentEntry): CommentView {
  return {
    id: c.id,
    author: c.authorName,
    body: c.body,
    createdAt: c.createdAt.toISOString(),
    on: c.intervalStartsAt && c.minimum !== null ? { interval: c.intervalStartsAt.toISOString(), minimum: c.minimum } : null,
  };
}

export async function runComments(networkId: string, runId: string): Promise<CommentView[]> {
  if (!(await getRun(networkId, runId))) throw notFound('That run is not in this network.');
  return (await listRunComments(networkId, runId)).map(viewOf);
}

export async function addRunComment(networkId: string, runId: string, authorId: string, c: NewComment): Promise<CommentView> {
  const run = await getRun(networkId, runId);
  if (!run) throw notFound('That run is not in this network.');
  let at: Date | null = null;
  if (c.interval !== undefined && c.minimum !== undefined) {
    at = new Date(c.interval);
    const row = await getRunInterval(runId, at);
    if (!row) throw badRequest(`interval: the run has no finished interval starting at ${at.toISOString()}`, 'interval');
    const count = ((row.result as { minima?: unknown[] }).minima ?? []).length;
    if (c.minimum >= count) throw badRequest(`minimum: that interval has ${count} minima (0 to ${count - 1})`, 'minimum');
  }
  const row = await insertRunComment({
    networkId,
    runId,
    authorId,
    body: c.body,
    intervalStartsAt: at,
    minimum: at ? c.minimum! : null,
  });
  const on = at ? `minimum ${c.minimum! + 1} of ${at.toISOString()} of ` : '';
  await record({
    networkId,
    actorId: authorId,
    action: 'created',
    subject: 'comment',
    subjectId: row.id,
    summary: `comment on ${on}run "${run.name}"`,
  });
  return viewOf({ ...row, authorName: null });
}

/** The comments of the run a link opens (read only). */
export async function sharedRunComments(token: string): Promise<CommentView[]> {
  const { networkId, runId } = await requireLink(token);
  return runComments(networkId, runId);
}
