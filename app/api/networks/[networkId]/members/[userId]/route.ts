import { json, parseJson, route } from '@/src/server/route';
import { requireNetworkAction } from '@/src/auth/permissions';
import { changeMemberRole, removeMember, roleChangeSchema } from '@/src/auth/networks';

type P = { networkId: string; userId: string };

/** Change a member's role (owners; the last owner stays an owner). */
export const PATCH = route<P>(async (req, { params }) => {
  const { user } = await requireNetworkAction(params.networkId, 'members.manage');
  const { role } = await parseJson(req, roleChangeSchema);
  await changeMemberRole(params.networkId, params.userId, role, user.id);
  return json({ ok: true, role });
});

/** Remove a member (owners; the last owner cannot be removed). */
export const DELETE = route<P>(async (_req, { params }) => {
  const { user } = await requireNetworkAction(params.networkId, 'members.manage');
  await removeMember(params.networkId, params.userId, user.id);
  return json({ ok: true });
});
