import { json, parseJson, requestOrigin, route } from '@/src/server/route';
import { SIGN_UP_ANSWER, signUp, signUpSchema } from '@/src/auth/accounts';

/** Create an account (or e-mail the owner of an address that has one); the answer is the same either way. */
export const POST = route(async (req) => {
  const input = await parseJson(req, signUpSchema);
  await signUp(input, requestOrigin(req));
  return json({ ok: true, message: SIGN_UP_ANSWER }, 202);
});
