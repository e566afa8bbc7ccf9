import { json, parseJson, route } from '@/src/server/route';
import { requireUser } from '@/src/auth/permissions';
import { acceptInvitationAs, acceptSchema } from '@/src/auth/networks';
import { clientAddress } from '@/src/auth/throttle';

type P = { token: string };

/**
 * Accept: as the signed-in user (mode "current", which requires a session),
 * by creating an account ("sign-up") or by signing in ("sign-in", throttled).
 */
export const POST = route<P>(async (req, { params }) => {
  const input = await parseJson(req, acceptSchema);
  const user = input.mode === 'current' ? await requireUser() : null;
  const r = await acceptInvitationAs(params.token, input, user, clientAddress(req));
  return json({ networkId: r.networkId, role: r.role }, 200, r.cookie ? { 'set-cookie': r.cookie } : undefined);
});
