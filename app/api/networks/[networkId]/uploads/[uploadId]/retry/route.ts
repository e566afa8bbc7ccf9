import { requireNetworkAction } from '@/src/auth/permissions';
import { json, route } from '@/src/server/route';
import { retryUpload } from '@/src/data/intake';
import { requireId } from '@/src/server/ids';

type P = { networkId: string; uploadId: string };

/** Queues a failed upload for processing again. */
export const POST = route<P>(async (_req, { params }) => {
  await requireNetworkAction(params.networkId, 'data.upload');
  return json({ upload: await retryUpload(params.networkId, requireId(params.uploadId, 'upload')) });
});
