import { json, route } from '@/src/server/route';
import { sharedRunView } from '@/src/sharing/shared-run';

type P = { token: string };

/** The shared run's view, for the holder of its link (no sign-in); 410 once the link is revoked or expired. */
export const GET = route<P>(async (_req, { params }) => {
  return json(await sharedRunView(params.token), 200, { 'cache-control': 'no-store', 'referrer-policy': 'no-referrer' });
});
