import { json, parseJson, route } from '@/src/server/route';
import { requireNetworkAction } from '@/src/auth/permissions';
import { createNetworkSchema, renameNetwork } from '@/src/auth/networks';

type P = { networkId: string };

export const GET = route<P>(async (_req, { params }) => {
  const { membership } = await requireNetworkAction(params.networkId, 'network.read');
  return json({ network: { id: membership.networkId, name: membership.networkName }, role: membership.role });
});

/** Rename (owners). */
export const PATCH = route<P>(async (req, { params }) => {
  await requireNetworkAction(params.networkId, 'network.manage');
  const { name } = await parseJson(req, createNetworkSchema);
  return json({ network: await renameNetwork(params.networkId, name) });
});
