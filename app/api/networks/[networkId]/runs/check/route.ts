import { requireNetworkAction } from '@/src/auth/permissions';
import { json, parseJson, route } from '@/src/server/route';
import { runConfigSchema } from '@/src/runs/config';
import { checkLaunch } from '@/src/runs/launch';

type P = { networkId: string };

/** What a launch would do (data, parameters, starts, time) and every problem with it; stores nothing. */
export const POST = route<P>(async (req, { params }) => {
  await requireNetworkAction(params.networkId, 'runs.launch');
  const config = await parseJson(req, runConfigSchema);
  const { problems, preview } = await checkLaunch(params.networkId, config);
  return json({
    problems,
    preview: preview && {
      ...preview,
      intervalStarts: undefined,
      firstInterval: preview.intervalStarts[0],
      lastInterval: preview.intervalStarts.at(-1),
    },
  });
});
