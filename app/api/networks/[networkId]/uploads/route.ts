import { z } from 'zod';
import { requireNetworkAction } from '@/src/auth/permissions';
import { json, parseQuery, route } from '@/src/server/route';
import { requireStation } from '@/src/data/stations';
import { listUploads } from '@/src/data/uploads';
import { receiveUpload } from '@/src/data/intake';

type P = { networkId: string };

export const GET = route<P>(async (req, { params }) => {
  await requireNetworkAction(params.networkId, 'network.read');
  const q = parseQuery(req, z.object({ station: z.uuid().optional() }));
  return json({ uploads: await listUploads(params.networkId, q.station) });
});

/**
 * One station file as the raw request body (streamed):
 * `POST …/uploads?station=<station id>&name=<file name>`.
 * 201 with the new upload, or 200 with the earlier upload of the same file.
 */
export const POST = route<P>(async (req, { params }) => {
  const { user } = await requireNetworkAction(params.networkId, 'data.upload');
  const q = parseQuery(
    req,
    z.object({ station: z.uuid({ message: 'choose the station the file belongs to' }), name: z.string().min(1).max(200) }),
  );
  const station = await requireStation(params.networkId, q.station);
  const length = req.headers.get('content-length');
  const out = await receiveUpload({
    station,
    userId: user.id,
    fileName: q.name,
    body: req.body,
    contentLength: length ? Number(length) : null,
  });
  return json(out, out.duplicate ? 200 : 201);
});
