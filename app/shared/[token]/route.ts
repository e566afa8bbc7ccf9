import { route } from '@/src/server/route';
import { openLink } from '@/src/sharing/links';
import { closedLinkResponse } from '@/src/sharing/link-pages';

type P = { token: string };

/**
 * A shared run link. A link that stands goes on to the run's read-only page;
 * a revoked or expired one answers a plain page with status 410, a tampered
 * or unknown one a plain page with status 404.
 */
export const GET = route<P>(async (_req, { params }) => {
  const o = await openLink(params.token);
  if (o.kind !== 'open') return closedLinkResponse(o);
  return new Response(null, {
    status: 303,
    headers: { location: `/shared/${params.token}/run`, 'cache-control': 'no-store', 'referrer-policy': 'no-referrer' },
  });
});
