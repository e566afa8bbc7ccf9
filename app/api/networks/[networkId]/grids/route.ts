import { requireNetworkAction } from '@/src/auth/permissions';
import { json, parseJson, route } from '@/src/server/route';
import { listGrids, saveGrid } from '@/src/runs/catalogue';
import { gridInputSchema } from '@/src/runs/grid-spec';

type P = { networkId: string };

export const GET = route<P>(async (_req, { params }) => {
  await requireNetworkAction(params.networkId, 'network.read');
  return json({ grids: await listGrids(params.networkId) });
});

export const POST = route<P>(async (req, { params }) => {
  const { user } = await requireNetworkAction(params.networkId, 'grids.edit');
  const body = await parseJson(req, gridInputSchema);
  return json({ grid: await saveGrid(params.networkId, user.id, body) }, 201);
});
