import { json, route } from '@/src/server/route';
import { getSessionUser } from '@/src/auth/session';

/** Who is signed in (null when nobody). Also renews a session past half its life. */
export const GET = route(async () => {
  const user = await getSessionUser();
  return json({ user }, 200, { 'cache-control': 'no-store' });
});
