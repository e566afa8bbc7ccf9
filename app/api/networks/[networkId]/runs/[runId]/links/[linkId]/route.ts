import { requireNetworkAction } from '@/src/auth/permissions';
import { json, route } from '@/src/server/route';
import { requireId } from '@/src/server/ids';
import { revokeLink } from '@/src/sharing/links';

type P = { networkId: string; runId: string; linkId: string };

/** Revokes the link: it opens nothing from now on (its page says so, status 410). */
export const DELETE = route<P>(async (_req, { params }) => {
  const { user } = await requireNetworkAction(params.networkId, 'runs.share');
  await revokeLink(params.networkId, requireId(params.runId, 'run'), requireId(params.linkId, 'link'), user.id);
  return json({ revoked: true });
});
