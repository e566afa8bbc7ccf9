import { z } from 'zod';
import { requireNetworkAction } from '@/src/auth/permissions';
import { json, parseQuery, route } from '@/src/server/route';
import { fitsAt } from '@/src/runs/fits';
import { requireId } from '@/src/server/ids';

type P = { networkId: string; runId: string };

const query = z.object({ interval: z.iso.datetime({ offset: true }), minimum: z.coerce.number().int().min(0).default(0) });

/** Observed vs predicted power and residuals per station/component at one minimum of one interval. */
export const GET = route<P>(async (req, { params }) => {
  await requireNetworkAction(params.networkId, 'network.read');
  const q = parseQuery(req, query);
  return json(await fitsAt(params.networkId, requireId(params.runId, 'run'), q.interval, q.minimum));
});
