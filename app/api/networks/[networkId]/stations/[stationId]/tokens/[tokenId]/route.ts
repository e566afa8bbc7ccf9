import { z } from 'zod';
import { requireNetworkAction } from '@/src/auth/permissions';
import { json, route } from '@/src/server/route';
import { revokePushToken } from '@/src/data/push-tokens';

type P = { networkId: string; stationId: string; tokenId: string };
const id = z.uuid();

/** Revokes the token (it stays listed, marked revoked). */
export const DELETE = route<P>(async (_req, { params }) => {
  await requireNetworkAction(params.networkId, 'tokens.manage');
  return json({ token: await revokePushToken(params.networkId, id.parse(params.stationId), id.parse(params.tokenId)) });
});
