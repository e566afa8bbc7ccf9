import { requireNetworkAction } from '@/src/auth/permissions';
import { json, parseJson, route } from '@/src/server/route';
import { listModelVersions, saveModel } from '@/src/runs/catalogue';
import { notFound } from '@/src/server/errors';
import { modelInputSchema } from '@/src/runs/model-spec';
import { requireId } from '@/src/server/ids';

type P = { networkId: string; modelId: string };

/** The model version at this id and every version of its lineage, newest first. */
export const GET = route<P>(async (_req, { params }) => {
  await requireNetworkAction(params.networkId, 'network.read');
  const versions = await listModelVersions(params.networkId, requireId(params.modelId, 'cavity model'));
  const model = versions.find((v) => v.id === params.modelId);
  if (!model) throw notFound('That cavity model is not in this network.');
  return json({ model, versions });
});

/** Saving an edit adds a new version; the one at this id stays as it was. */
export const POST = route<P>(async (req, { params }) => {
  const { user } = await requireNetworkAction(params.networkId, 'models.edit');
  const body = await parseJson(req, modelInputSchema);
  return json({ model: await saveModel(params.networkId, user.id, body, requireId(params.modelId, 'cavity model')) }, 201);
});
