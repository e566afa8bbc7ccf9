import { requireNetworkAction } from '@/src/auth/permissions';
import { json, route } from '@/src/server/route';
import { getRunView } from '@/src/runs/results';
import { removeRun } from '@/src/runs/control';
import { requireId } from '@/src/runs/ids';

type P = { networkId: string; runId: string };

/** The run with its settings, progress and every finished interval's result. */
export const GET = route<P>(async (_req, { params }) => {
  await requireNetworkAction(params.networkId, 'network.read');
  return json(await getRunView(params.networkId, requireId(params.runId, 'run')), 200, { 'cache-control': 'no-store' });
});

export const DELETE = route<P>(async (_req, { params }) => {
  await requireNetworkAction(params.networkId, 'runs.delete');
  await removeRun(params.networkId, requireId(params.runId, 'run'));
  return json({ deleted: true });
});
