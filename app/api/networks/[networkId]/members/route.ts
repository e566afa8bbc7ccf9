import { json, route } from '@/src/server/route';
import { can, requireNetworkAction } from '@/src/auth/permissions';
import { membersOverview } from '@/src/auth/networks';

type P = { networkId: string };

/** Members with roles; open invitations too when the caller may manage members. */
export const GET = route<P>(async (_req, { params }) => {
  const { membership } = await requireNetworkAction(params.networkId, 'network.read');
  return json(await membersOverview(params.networkId, can(membership.role, 'members.manage')));
});
