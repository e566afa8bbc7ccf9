import { z } from 'zod';
import { requireNetworkAction } from '@/src/auth/permissions';
import { json, parseJson, route } from '@/src/server/route';
import { requireStation } from '@/src/data/stations';
import { issuePushToken, listPushTokens } from '@/src/data/push-tokens';
import { requireId } from '@/src/server/ids';

type P = { networkId: string; stationId: string };
const body = z.object({
  label: z.string().trim().min(1, 'give the token a label, e.g. the computer it lives on').max(80),
  expiresInDays: z.number().int().min(1).max(3650).nullable().default(365),
});

export const GET = route<P>(async (_req, { params }) => {
  await requireNetworkAction(params.networkId, 'tokens.manage');
  const station = await requireStation(params.networkId, requireId(params.stationId, 'station'));
  return json({ tokens: await listPushTokens(params.networkId, station.id) });
});

export const POST = route<P>(async (req, { params }) => {
  const { user } = await requireNetworkAction(params.networkId, 'tokens.manage');
  const station = await requireStation(params.networkId, requireId(params.stationId, 'station'));
  const input = await parseJson(req, body);
  return json(await issuePushToken(params.networkId, station.id, user.id, input), 201);
});
