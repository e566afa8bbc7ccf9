import { requireNetworkAction } from '@/src/auth/permissions';
import { json, parseJson, route } from '@/src/server/route';
import { requireId } from '@/src/server/ids';
import { addRunComment, newCommentSchema, runComments } from '@/src/sharing/comments';

type P = { networkId: string; runId: string };

/** The run's comments, oldest first, with author and time. */
export const GET = route<P>(async (_req, { params }) => {
  await requireNetworkAction(params.networkId, 'network.read');
  return json({ comments: await runComments(params.networkId, requireId(params.runId, 'run')) }, 200, {
    'cache-control': 'no-store',
  });
});

/** A comment on the run, or (with `interval` and `minimum`) on one minimum of one interval. */
export const POST = route<P>(async (req, { params }) => {
  const { user } = await requireNetworkAction(params.networkId, 'comments.write');
  const runId = requireId(params.runId, 'run');
  const body = await parseJson(req, newCommentSchema);
  return json({ comment: await addRunComment(params.networkId, runId, user.id, body) }, 201);
});
