import { requireNetworkAction } from '@/src/auth/permissions';
import { json, route } from '@/src/server/route';
import { rerunRun } from '@/src/runs/control';
import { requireId } from '@/src/server/ids';

type P = { networkId: string; runId: string };

/** Queues a failed or cancelled run again; intervals it finished are kept and skipped. */
export const POST = route<P>(async (_req, { params }) => {
  const { user } = await requireNetworkAction(params.networkId, 'runs.launch');
  const run = await rerunRun(params.networkId, requireId(params.runId, 'run'), user.id);
  return json({ run: { id: run.id, state: run.state } }, 202);
});
