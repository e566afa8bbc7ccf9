import { z } from 'zod';
import { json, parseQuery, route } from '@/src/server/route';
import { sharedRunFits } from '@/src/sharing/shared-run';

type P = { token: string };

const query = z.object({ interval: z.iso.datetime({ offset: true }), minimum: z.coerce.number().int().min(0).default(0) });

/** Fits of one minimum of one interval of the shared run, for the holder of its link. */
export const GET = route<P>(async (req, { params }) => {
  const q = parseQuery(req, query);
  return json(await sharedRunFits(params.token, q.interval, q.minimum), 200, { 'cache-control': 'no-store' });
});
