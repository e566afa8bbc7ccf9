import { json, route } from '@/src/server/route';
import { requireNetworkAction } from '@/src/auth/permissions';
import { revokeInvitation } from '@/src/auth/networks';

type P = { networkId: string; invitationId: string };

/** Withdraw an open invitation (owners). */
export const DELETE = route<P>(async (_req, { params }) => {
  await requireNetworkAction(params.networkId, 'members.manage');
  await revokeInvitation(params.networkId, params.invitationId);
  return json({ ok: true });
});
