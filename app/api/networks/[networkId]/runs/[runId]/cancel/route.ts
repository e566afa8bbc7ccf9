import { requireNetworkAction } from '@/src/auth/permissions';
import { json, route } from '@/src/server/route';
import { cancelRun } from '@/src/runs/control';
import { requireId } from '@/src/server/ids';

type P = { networkId: string; runId: string };

export const POST = route<P>(async (_req, { params }) => {
  const { user } = await requireNetworkAction(params.networkId, 'runs.cancel');
  const run = await cancelRun(params.networkId, requireId(params.runId, 'run'), user.id);
  return json({ run: { id: run.id, state: run.state, cancelRequested: run.cancelRequested } });
});
