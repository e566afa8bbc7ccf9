import { json, route, toErrorResponse } from '@/src/server/route';
import { badRequest } from '@/src/server/errors';
import { authenticatePush, pushRateLimit } from '@/src/data/push-tokens';
import { pushBodySchema, readPushBody, receivePush } from '@/src/data/push';

/**
 * A station computer sends one 10-minute interval:
 *   POST /api/v1/push/intervals, Authorization: Bearer <token>,
 *   { "startsAt": "…Z", "sampleRateHz": 200, "components": { "Ez": [...], "Bns": [...] } }
 * 201 when new intervals were stored, 200 when the same interval was already there.
 */
const handler = route(async (req) => {
  const token = await authenticatePush(req.headers.get('authorization'));
  const text = await readPushBody(req);
  let data: unknown;
  try {
    data = JSON.parse(text);
  } catch {
    throw badRequest('The request body is not valid JSON.', 'body');
  }
  const out = await receivePush(token, pushBodySchema.parse(data));
  return json(out, out.intervals.some((i) => i.created) ? 201 : 200);
});

export async function POST(req: Request): Promise<Response> {
  try {
    const res = await handler(req);
    // A full rate window: tell the station computer when to try again (at most one window).
    if (res.status === 429) res.headers.set('retry-after', String(pushRateLimit().windowSeconds));
    return res;
  } catch (e) {
    return toErrorResponse(e);
  }
}
