import { json, parseJson, route } from '@/src/server/route';
import { requireUser } from '@/src/auth/permissions';
import { createNetwork, createNetworkSchema, listNetworksForUser } from '@/src/auth/networks';

/** The caller's networks with their role in each. */
export const GET = route(async () => {
  const user = await requireUser();
  return json({ networks: await listNetworksForUser(user.id) });
});

/** Create a network; the caller becomes its owner. */
export const POST = route(async (req) => {
  const user = await requireUser();
  const { name } = await parseJson(req, createNetworkSchema);
  return json({ network: await createNetwork(name, user.id) }, 201);
});
