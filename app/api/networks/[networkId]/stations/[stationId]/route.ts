import { requireNetworkAction } from '@/src/auth/permissions';
import { json, parseJson, route } from '@/src/server/route';
import { deleteStation, requireStation, updateStation } from '@/src/data/stations';
import { stationInputSchema } from '@/src/data/station-input';
import { requireId } from '@/src/server/ids';

type P = { networkId: string; stationId: string };

export const GET = route<P>(async (_req, { params }) => {
  await requireNetworkAction(params.networkId, 'network.read');
  return json({ station: await requireStation(params.networkId, requireId(params.stationId, 'station')) });
});

export const PUT = route<P>(async (req, { params }) => {
  const { user } = await requireNetworkAction(params.networkId, 'stations.manage');
  const body = await parseJson(req, stationInputSchema);
  return json({ station: await updateStation(params.networkId, requireId(params.stationId, 'station'), body, user.id) });
});

export const DELETE = route<P>(async (_req, { params }) => {
  const { user } = await requireNetworkAction(params.networkId, 'stations.manage');
  await deleteStation(params.networkId, requireId(params.stationId, 'station'), user.id);
  return json({ ok: true });
});
