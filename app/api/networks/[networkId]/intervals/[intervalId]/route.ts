import { z } from 'zod';
import { requireNetworkAction } from '@/src/auth/permissions';
import { json, parseJson, route } from '@/src/server/route';
import { flagInterval, getIntervalDetail } from '@/src/data/intervals';
import { requireId } from '@/src/server/ids';

type P = { networkId: string; intervalId: string };
const flagBody = z.discriminatedUnion('flagged', [
  z.object({ flagged: z.literal(true), reason: z.string().trim().min(1, 'say why the interval is flagged').max(500) }),
  z.object({ flagged: z.literal(false) }),
]);

export const GET = route<P>(async (_req, { params }) => {
  await requireNetworkAction(params.networkId, 'network.read');
  return json({ interval: await getIntervalDetail(params.networkId, requireId(params.intervalId, 'interval')) });
});

/** Flag (with a reason) or unflag an interval. */
export const PATCH = route<P>(async (req, { params }) => {
  const { user } = await requireNetworkAction(params.networkId, 'data.flag');
  const body = await parseJson(req, flagBody);
  return json({ interval: await flagInterval(params.networkId, requireId(params.intervalId, 'interval'), user.id, body) });
});
