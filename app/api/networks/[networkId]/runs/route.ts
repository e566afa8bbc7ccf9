import { requireNetworkAction } from '@/src/auth/permissions';
import { json, parseJson, route } from '@/src/server/route';
import { listRuns } from '@/src/runs/control';
import { runConfigSchema } from '@/src/runs/config';
import { launchRun } from '@/src/runs/launch';

type P = { networkId: string };

export const GET = route<P>(async (_req, { params }) => {
  await requireNetworkAction(params.networkId, 'network.read');
  return json({ runs: await listRuns(params.networkId) });
});

/** Stores the run and queues it; returns at once with the run (state "queued"). */
export const POST = route<P>(async (req, { params }) => {
  const { user } = await requireNetworkAction(params.networkId, 'runs.launch');
  const config = await parseJson(req, runConfigSchema);
  const run = await launchRun(params.networkId, user.id, config);
  return json({ run: { id: run.id, name: run.name, state: run.state, progress: run.progress } }, 202);
});
