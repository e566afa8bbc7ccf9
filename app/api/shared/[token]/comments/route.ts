import { json, route } from '@/src/server/route';
import { sharedRunComments } from '@/src/sharing/comments';

type P = { token: string };

/** The shared run's comments, for the holder of its link (read only: there is no POST here). */
export const GET = route<P>(async (_req, { params }) => {
  return json({ comments: await sharedRunComments(params.token) }, 200, { 'cache-control': 'no-store' });
});
