import { z } from 'zod';
import { json, parseQuery, route } from '@/src/server/route';
import { sharedRunInterval, sharedRunView } from '@/src/sharing/shared-run';

type P = { token: string };

const query = z.object({
  /** One interval whole: `{ interval }`. */
  interval: z.iso
    .datetime({ offset: true, error: 'give the interval start as an ISO time like 2026-03-01T00:10:00Z' })
    .transform((s) => new Date(s))
    .optional(),
});

/**
 * The shared run for the holder of its link (no sign-in): a summary, or with `?interval=` one
 * interval whole. 410 once the link is revoked or expired, 404 for a token that is not valid.
 */
export const GET = route<P>(async (req, { params }) => {
  const q = parseQuery(req, query);
  const headers = { 'cache-control': 'no-store', 'referrer-policy': 'no-referrer' };
  if (q.interval) return json({ interval: await sharedRunInterval(params.token, q.interval) }, 200, headers);
  return json(await sharedRunView(params.token), 200, headers);
});
