import { z } from 'zod';
import { requireNetworkAction } from '@/src/auth/permissions';
import { json, parseJson, route } from '@/src/server/route';
import { deleteStation, requireStation, updateStation } from '@/src/data/stations';
import { stationInputSchema } from '@/src/data/station-input';

type P = { networkId: string; stationId: string };
const id = z.uuid();

export const GET = route<P>(async (_req, { params }) => {
  await requireNetworkAction(params.networkId, 'network.read');
  return json({ station: await requireStation(params.networkId, id.parse(params.stationId)) });
});

export const PUT = route<P>(async (req, { params }) => {
  await requireNetworkAction(params.networkId, 'stations.manage');
  const body = await parseJson(req, stationInputSchema);
  return json({ station: await updateStation(params.networkId, id.parse(params.stationId), body) });
});

export const DELETE = route<P>(async (_req, { params }) => {
  await requireNetworkAction(params.networkId, 'stations.manage');
  await deleteStation(params.networkId, id.parse(params.stationId));
  return json({ ok: true });
});
