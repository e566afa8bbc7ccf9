import { json, route } from '@/src/server/route';
import { viewInvitation } from '@/src/auth/networks';

type P = { token: string };

/**
 * What an invitation offers. Public: holding the secret token is the
 * permission; unknown or withdrawn is 404, used or expired is 410.
 */
export const GET = route<P>(async (_req, { params }) => {
  const inv = await viewInvitation(params.token);
  return json({
    invitation: {
      networkName: inv.networkName,
      email: inv.email,
      role: inv.role,
      expiresAt: inv.expiresAt,
      hasAccount: inv.hasAccount,
    },
  });
});
