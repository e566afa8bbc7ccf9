import { requireNetworkAction } from '@/src/auth/permissions';
import { json, parseJson, route } from '@/src/server/route';
import { z } from 'zod';
import { importCase } from '@/src/runs/case-import';

type P = { networkId: string };

/** A case file (JSON body) becomes a queued run: 201 `{ runId }`; a bad case is refused with its field named. */
export const POST = route<P>(async (req, { params }) => {
  const { user } = await requireNetworkAction(params.networkId, 'runs.launch');
  const body = await parseJson(req, z.unknown());
  return json(await importCase(params.networkId, user.id, body), 201);
});
