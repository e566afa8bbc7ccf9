import { requireNetworkAction } from '@/src/auth/permissions';
import { json, parseQuery, route } from '@/src/server/route';
import { listIntervals } from '@/src/data/intervals';
import { intervalQuerySchema, toFilter } from '@/src/data/interval-query';

type P = { networkId: string };

export const GET = route<P>(async (req, { params }) => {
  await requireNetworkAction(params.networkId, 'network.read');
  const q = parseQuery(req, intervalQuerySchema);
  return json({ intervals: await listIntervals(toFilter(params.networkId, q)) });
});
