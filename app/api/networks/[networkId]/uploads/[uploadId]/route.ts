import { requireNetworkAction } from '@/src/auth/permissions';
import { json, route } from '@/src/server/route';
import { deleteUpload, requireUpload } from '@/src/data/uploads';
import { requireId } from '@/src/server/ids';

type P = { networkId: string; uploadId: string };

export const GET = route<P>(async (_req, { params }) => {
  await requireNetworkAction(params.networkId, 'network.read');
  return json({ upload: await requireUpload(params.networkId, requireId(params.uploadId, 'upload')) });
});

/** Deletes the stored file (intervals made from it stay). */
export const DELETE = route<P>(async (_req, { params }) => {
  await requireNetworkAction(params.networkId, 'data.delete');
  await deleteUpload(params.networkId, requireId(params.uploadId, 'upload'));
  return json({ ok: true });
});
