import { json, parseJson, route } from '@/src/server/route';
import { requireUser } from '@/src/auth/permissions';
import { changePassword, passwordChangeSchema } from '@/src/auth/accounts';
import { clientAddress } from '@/src/auth/throttle';

/** Change the signed-in person's password (the current one is checked, throttled); ends their other sessions. */
export const POST = route(async (req) => {
  const user = await requireUser();
  const input = await parseJson(req, passwordChangeSchema);
  const ended = await changePassword(user, req.headers.get('cookie') ?? '', input, clientAddress(req));
  return json({ ok: true, otherSessionsEnded: ended });
});
