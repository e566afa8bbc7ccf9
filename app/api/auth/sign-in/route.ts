import { json, parseJson, route } from '@/src/server/route';
import { signIn, signInSchema } from '@/src/auth/accounts';
import { clientAddress } from '@/src/auth/throttle';

/** Check e-mail and password (throttled) and start a session. */
export const POST = route(async (req) => {
  const input = await parseJson(req, signInSchema);
  const { user, cookie } = await signIn(input, clientAddress(req));
  return json({ user }, 200, { 'set-cookie': cookie });
});
