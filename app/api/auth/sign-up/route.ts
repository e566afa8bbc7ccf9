import { json, parseJson, route } from '@/src/server/route';
import { signUp, signUpSchema } from '@/src/auth/accounts';

/** Create an account and start a session. */
export const POST = route(async (req) => {
  const input = await parseJson(req, signUpSchema);
  const { user, cookie } = await signUp(input);
  return json({ user }, 201, { 'set-cookie': cookie });
});
