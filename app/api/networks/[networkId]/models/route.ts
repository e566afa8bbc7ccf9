import { requireNetworkAction } from '@/src/auth/permissions';
import { json, parseJson, route } from '@/src/server/route';
import { listModels, saveModel } from '@/src/runs/catalogue';
import { modelInputSchema } from '@/src/runs/model-spec';

type P = { networkId: string };

export const GET = route<P>(async (_req, { params }) => {
  await requireNetworkAction(params.networkId, 'network.read');
  return json({ models: await listModels(params.networkId) });
});

export const POST = route<P>(async (req, { params }) => {
  const { user } = await requireNetworkAction(params.networkId, 'models.edit');
  const body = await parseJson(req, modelInputSchema);
  return json({ model: await saveModel(params.networkId, user.id, body) }, 201);
});
