/**
 * Comments on a run and on its minima: every member may write them (viewers
 * too), link holders read them and cannot write (the link's API has no write),
 * other networks get 404 (common practice: foreign ids are not confirmed).
 * Text is kept as written (markup included: it is shown as text) and limited
 * in length; a comment on a minimum must name one that exists.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { closeQueueAndDatabase, resetDatabase } from '@/test/helpers/db';
import { CALLERS, call, errorOf, type CallerName } from '@/test/helpers/authz';
import * as commentsRoute from '@/app/api/networks/[networkId]/runs/[runId]/comments/route';
import * as linksRoute from '@/app/api/networks/[networkId]/runs/[runId]/links/route';
import * as linkRoute from '@/app/api/networks/[networkId]/runs/[runId]/links/[linkId]/route';
import * as sharedComments from '@/app/api/shared/[token]/comments/route';
import { MAX_COMMENT_CHARS, type CommentView } from '@/src/sharing/comments';
import { makeSharingWorld, type SharingWorld } from './world';

let w: SharingWorld;
const R = () => ({ networkId: w.networkId, runId: w.runId });
const post = (c: CallerName, body: unknown) => call(commentsRoute.POST, w.callers[c], { method: 'POST', params: R(), body });

beforeAll(async () => {
  await resetDatabase();
  w = await makeSharingWorld('comments');
});
afterAll(() => closeQueueAndDatabase());

describe('comments', () => {
  it('GET: anonymous, viewer, analyst, owner, other network → 401, 200, 200, 200, 404', async () => {
    const got: number[] = [];
    for (const c of CALLERS) got.push((await call(commentsRoute.GET, w.callers[c], { params: R() })).status);
    expect(got).toEqual([401, 200, 200, 200, 404]);
  });

  it('POST: anonymous, viewer, analyst, owner, other network → 401, 201, 201, 201, 404', async () => {
    const got: number[] = [];
    for (const c of CALLERS) got.push((await post(c, { body: `from ${c}` })).status);
    expect(got).toEqual([401, 201, 201, 201, 404]);
  });

  it('keeps author, time, target and the text as written; lists oldest first', async () => {
    const text = '<script>alert(1)</script> & <b>not bold</b>';
    const res = await post('analyst', { body: `  ${text}\n`, interval: w.intervals[0], minimum: 0 });
    expect(res.status).toBe(201);
    const list = (await (await call(commentsRoute.GET, w.callers.viewer, { params: R() })).json()) as { comments: CommentView[] };
    const last = list.comments.at(-1)!;
    expect(last).toMatchObject({ author: 'Analyst comments', body: text, on: { interval: w.intervals[0], minimum: 0 } });
    expect(Math.abs(Date.parse(last.createdAt) - Date.now())).toBeLessThan(60_000);
    const times = list.comments.map((c) => Date.parse(c.createdAt));
    expect([...times].sort((a, b) => a - b)).toEqual(times);
    expect(list.comments.find((c) => c.body === 'from viewer')!.on).toBeNull();
  });

  it('refuses empty, too long, half-targeted and missing targets, naming the field', async () => {
    const cases: [unknown, string][] = [
      [{ body: '   ' }, 'body'],
      [{ body: 'x'.repeat(MAX_COMMENT_CHARS + 1) }, 'body'],
      [{ body: 42 }, 'body'],
      [{ body: 'half', interval: w.intervals[0] }, 'minimum'],
      [{ body: 'no such minimum', interval: w.intervals[0], minimum: 999 }, 'minimum'],
      [{ body: 'no such interval', interval: '2030-01-01T00:00:00Z', minimum: 0 }, 'interval'],
    ];
    for (const [body, field] of cases) {
      const res = await post('owner', body);
      expect(res.status, JSON.stringify(body).slice(0, 60)).toBe(400);
      expect((await errorOf(res)).field).toBe(field);
    }
    expect((await post('owner', { body: 'x'.repeat(MAX_COMMENT_CHARS) })).status).toBe(201);
  });

  it('link holders read them, cannot write, and lose them with the link', async () => {
    const made = await call(linksRoute.POST, w.callers.owner, { method: 'POST', params: R(), body: { expiresInDays: 1 } });
    const { id, url } = (await made.json()) as { id: string; url: string };
    const token = new URL(url).pathname.split('/')[2];
    const res = await call(sharedComments.GET, null, { params: { token } });
    expect(res.status).toBe(200);
    const { comments } = (await res.json()) as { comments: CommentView[] };
    expect(comments.some((c) => c.body === 'from owner')).toBe(true);
    expect(Object.keys(sharedComments)).toEqual(['GET']);
    await call(linkRoute.DELETE, w.callers.owner, { method: 'DELETE', params: { ...R(), linkId: id } });
    expect((await call(sharedComments.GET, null, { params: { token } })).status).toBe(410);
  });
});
