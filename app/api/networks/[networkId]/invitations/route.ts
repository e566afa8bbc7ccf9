import { json, parseJson, requestOrigin, route } from '@/src/server/route';
import { requireNetworkAction } from '@/src/auth/permissions';
import { inviteMember, inviteSchema, membersOverview } from '@/src/auth/networks';

type P = { networkId: string };

/** Open invitations (owners). */
export const GET = route<P>(async (_req, { params }) => {
  await requireNetworkAction(params.networkId, 'members.manage');
  const { invitations } = await membersOverview(params.networkId, true);
  return json({ invitations });
});

/** Invite by e-mail with a role (owners); the link is mailed and returned. */
export const POST = route<P>(async (req, { params }) => {
  const { user, membership } = await requireNetworkAction(params.networkId, 'members.manage');
  const input = await parseJson(req, inviteSchema);
  return json(await inviteMember(params.networkId, membership.networkName, user, input, requestOrigin(req)), 201);
});
