import { json, parseJson, route } from '@/src/server/route';
import { resetConfirmSchema, resetPassword } from '@/src/auth/accounts';

/** Use a reset token once: set the new password and end every session of the account. */
export const POST = route(async (req) => {
  const { token, password } = await parseJson(req, resetConfirmSchema);
  await resetPassword(token, password);
  return json({ ok: true });
});
