import { z } from 'zod';
import { requireNetworkAction } from '@/src/auth/permissions';
import { json, route } from '@/src/server/route';
import { deleteUpload, requireUpload } from '@/src/data/uploads';

type P = { networkId: string; uploadId: string };
const id = z.uuid();

export const GET = route<P>(async (_req, { params }) => {
  await requireNetworkAction(params.networkId, 'network.read');
  return json({ upload: await requireUpload(params.networkId, id.parse(params.uploadId)) });
});

/** Deletes the stored file (intervals made from it stay). */
export const DELETE = route<P>(async (_req, { params }) => {
  await requireNetworkAction(params.networkId, 'data.delete');
  await deleteUpload(params.networkId, id.parse(params.uploadId));
  return json({ ok: true });
});
