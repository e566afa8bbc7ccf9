import { requireNetworkAction } from '@/src/auth/permissions';
import { json, route } from '@/src/server/route';
import { revokePushToken } from '@/src/data/push-tokens';
import { requireId } from '@/src/server/ids';

type P = { networkId: string; stationId: string; tokenId: string };

/** Revokes the token (it stays listed, marked revoked). */
export const DELETE = route<P>(async (_req, { params }) => {
  await requireNetworkAction(params.networkId, 'tokens.manage');
  return json({
    token: await revokePushToken(
      params.networkId,
      requireId(params.stationId, 'station'),
      requireId(params.tokenId, 'push token'),
    ),
  });
});
