import { requireNetworkAction } from '@/src/auth/permissions';
import { json, parseJson, route } from '@/src/server/route';
import { requestSurface, surfaceSpecSchema } from '@/src/runs/surfaces';
import { requireId } from '@/src/server/ids';

type P = { networkId: string; runId: string };

/** Asks for a misfit surface (cached by its settings); computed by the worker. Poll the returned id. */
export const POST = route<P>(async (req, { params }) => {
  await requireNetworkAction(params.networkId, 'runs.launch');
  const spec = await parseJson(req, surfaceSpecSchema);
  const row = await requestSurface(params.networkId, requireId(params.runId, 'run'), spec);
  return json({ surface: row }, row.state === 'ready' ? 200 : 202);
});
