import { json, route } from '@/src/server/route';
import { signOut } from '@/src/auth/accounts';

/** End the current session (harmless when there is none). */
export const POST = route(async (req) => {
  const cookie = await signOut(req.headers.get('cookie') ?? '');
  return json({ ok: true }, 200, { 'set-cookie': cookie });
});
