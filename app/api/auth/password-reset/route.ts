import { json, parseJson, requestOrigin, route } from '@/src/server/route';
import { requestPasswordReset, resetRequestSchema } from '@/src/auth/accounts';

/** Mail a reset link if the address has an account; the answer is the same either way. */
export const POST = route(async (req) => {
  const { email } = await parseJson(req, resetRequestSchema);
  await requestPasswordReset(email, requestOrigin(req));
  return json(
    { ok: true, message: 'If this address has an account, a reset link is on its way. It works once, for one hour.' },
    202,
  );
});
