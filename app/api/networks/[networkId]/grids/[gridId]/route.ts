import { requireNetworkAction } from '@/src/auth/permissions';
import { json, parseJson, route } from '@/src/server/route';
import { listGridVersions, saveGrid } from '@/src/runs/catalogue';
import { notFound } from '@/src/server/errors';
import { gridInputSchema } from '@/src/runs/grid-spec';
import { requireId } from '@/src/server/ids';

type P = { networkId: string; gridId: string };

export const GET = route<P>(async (_req, { params }) => {
  await requireNetworkAction(params.networkId, 'network.read');
  const versions = await listGridVersions(params.networkId, requireId(params.gridId, 'source grid'));
  const grid = versions.find((v) => v.id === params.gridId);
  if (!grid) throw notFound('That source grid is not in this network.');
  return json({ grid, versions: versions.map(({ regions: _r, ...v }) => v) });
});

/** Saving an edit adds a new version; runs that pinned this one keep it. */
export const POST = route<P>(async (req, { params }) => {
  const { user } = await requireNetworkAction(params.networkId, 'grids.edit');
  const body = await parseJson(req, gridInputSchema);
  return json({ grid: await saveGrid(params.networkId, user.id, body, requireId(params.gridId, 'source grid')) }, 201);
});
