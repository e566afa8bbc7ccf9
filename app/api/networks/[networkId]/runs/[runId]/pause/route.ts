import { z } from 'zod';
import { requireNetworkAction } from '@/src/auth/permissions';
import { json, parseJson, route } from '@/src/server/route';
import { setRunPaused } from '@/src/runs/control';
import { requireId } from '@/src/server/ids';

type P = { networkId: string; runId: string };

const body = z.object({ paused: z.boolean({ error: 'paused: give true to pause the run or false to resume it' }) });

/** Pauses a queued or running run ({ paused: true }) or resumes a paused one ({ paused: false }). */
export const POST = route<P>(async (req, { params }) => {
  const { user } = await requireNetworkAction(params.networkId, 'runs.cancel');
  const { paused } = await parseJson(req, body);
  const run = await setRunPaused(params.networkId, requireId(params.runId, 'run'), paused, user.id);
  return json({ run: { id: run.id, state: run.state } }, 202);
});
