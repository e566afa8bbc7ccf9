import { requireNetworkAction } from '@/src/auth/permissions';
import { json, parseJson, route } from '@/src/server/route';
import { createStation, listStations } from '@/src/data/stations';
import { stationInputSchema } from '@/src/data/station-input';

type P = { networkId: string };

export const GET = route<P>(async (_req, { params }) => {
  await requireNetworkAction(params.networkId, 'network.read');
  return json({ stations: await listStations(params.networkId) });
});

export const POST = route<P>(async (req, { params }) => {
  const { user } = await requireNetworkAction(params.networkId, 'stations.manage');
  const body = await parseJson(req, stationInputSchema);
  return json({ station: await createStation(params.networkId, body, user.id) }, 201);
});
