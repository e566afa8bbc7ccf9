import { requireNetworkAction } from '@/src/auth/permissions';
import { json, route } from '@/src/server/route';
import { readSurface } from '@/src/runs/surfaces';
import { requireId } from '@/src/server/ids';

type P = { networkId: string; runId: string; surfaceId: string };

export const GET = route<P>(async (_req, { params }) => {
  await requireNetworkAction(params.networkId, 'network.read');
  const row = await readSurface(params.networkId, requireId(params.runId, 'run'), requireId(params.surfaceId, 'misfit surface'));
  return json({ surface: row }, 200, { 'cache-control': 'no-store' });
});
