/**
 * Account operations behind the auth routes: sign up, sign in (throttled),
 * sign out, password reset by e-mail. Each returns what the route needs,
 * including the Set-Cookie value when a session starts or ends. Sign-up and
 * reset answer the same, in the same time, whether or not an account exists.
 */
import { z } from 'zod';
import { generateIdFromEntropySize } from 'lucia';
import {
  findUserByEmail,
  insertUser,
  insertPasswordReset,
  consumePasswordReset,
  setPasswordEndingOtherSessions,
  normalizeEmail,
  type UserRow,
} from '@/db/repo/users';
import { AppError, badRequest, forbidden, unauthorized } from '@/src/server/errors';
import { getLucia } from './lucia';
import { runInBackground } from '@/src/server/background';
import { sendMail } from '@/src/server/mail';
import { hashPassword, passwordSchema, verifyPassword } from './password';
import { mayMailReset, MAIL_LIMITS } from './mail-limits';
import { assertNotThrottled, clearAccountThrottle, recordFailure, throttleKeys } from './throttle';
import { endSession, startSession, type User } from './session';
import { hashToken, newToken, RESET_LIFETIME_MS } from './tokens';
import { getInstanceSettings } from './settings';

export const emailSchema = z
  .string({ error: 'Enter an e-mail address.' })
  .trim()
  .min(1, { error: 'Enter an e-mail address.' })
  .max(254, { error: 'This e-mail address is too long.' })
  .pipe(z.email({ error: 'Enter a valid e-mail address, like name@example.org.' }))
  .transform(normalizeEmail);

export const nameSchema = z
  .string({ error: 'Enter your name.' })
  .trim()
  .min(1, { error: 'Enter your name.' })
  .max(120, { error: 'Keep the name to 120 characters or fewer.' });

export const signUpSchema = z.object({ email: emailSchema, name: nameSchema, password: passwordSchema });
export const signInSchema = z.object({
  email: emailSchema,
  password: z.string({ error: 'Enter your password.' }).min(1, { error: 'Enter your password.' }),
});
export const passwordChangeSchema = z.object({
  currentPassword: z.string({ error: 'Enter your current password.' }).min(1, { error: 'Enter your current password.' }),
  newPassword: passwordSchema,
});
export const resetRequestSchema = z.object({ email: emailSchema });
export const resetConfirmSchema = z.object({
  token: z.string().min(10, { error: 'The reset link is incomplete.' }),
  password: passwordSchema,
});

export function publicUser(u: Pick<UserRow, 'id' | 'email' | 'name' | 'isAdmin'>): User {
  return { id: u.id, email: u.email, name: u.name, isAdmin: u.isAdmin };
}

export function newUserId(): string {
  return generateIdFromEntropySize(10);
}

/** The one answer to every sign-up, whether or not the address already had an account. */
export const SIGN_UP_ANSWER =
  'Thank you. If this address is new, its account is ready: sign in with it. If it already had an account, ' +
  'we have e-mailed its owner instead.';

/**
 * Create an account — or, when the address already has one, e-mail its owner instead. Both
 * take the same time (the password is hashed either way; mail is sent in the background) and
 * get the same answer, so sign-up does not tell who has an account. No session starts here:
 * the sign-up form signs in next with the same password.
 */
export async function signUp(input: z.infer<typeof signUpSchema>, origin: string): Promise<void> {
  const settings = await getInstanceSettings();
  if (!settings.openSignUp) throw forbidden('New accounts on this instance need an invitation from a network owner.');
  const passwordHash = await hashPassword(input.password);
  const existing = await findUserByEmail(input.email);
  if (!existing) {
    try {
      await insertUser({ id: newUserId(), email: input.email, name: input.name, passwordHash });
      return;
    } catch (e) {
      if (!(e instanceof AppError && e.status === 409)) throw e; // taken in the meantime: mail its owner
    }
  }
  runInBackground('sign-up notice mail', async () => {
    const owner = existing ?? (await findUserByEmail(input.email));
    if (!owner) return;
    await sendMail({
      to: owner.email,
      subject: 'Cavitas: someone tried to create an account with your address',
      text:
        `Hello ${owner.name},\n\nSomeone (perhaps you) tried to create a new Cavitas account with this address, ` +
        `which already has one. Nothing was changed.\n\nTo sign in: ${origin}/sign-in\n` +
        `If you forgot your password: ${origin}/forgot-password\n`,
    });
  });
}

const WRONG = 'The e-mail address or password is not right.';

/** Check the password; throttled per account and per client address. */
export async function authenticate(email: string, password: string, address: string, now = new Date()): Promise<UserRow> {
  const keys = throttleKeys(email, address);
  await assertNotThrottled(keys, now);
  const user = await findUserByEmail(email);
  const ok = user ? await verifyPassword(user.passwordHash, password) : await hashPassword(password).then(() => false);
  if (!user || !ok) {
    await recordFailure(keys, now);
    throw unauthorized(WRONG);
  }
  await clearAccountThrottle(email);
  return user;
}

export async function signIn(input: z.infer<typeof signInSchema>, address: string): Promise<{ user: User; cookie: string }> {
  const user = await authenticate(input.email, input.password, address);
  return { user: publicUser(user), cookie: await startSession(user.id) };
}

/**
 * Change the signed-in person's password: the current one is checked (throttled like a sign-in),
 * then the new one is set, unused reset links are retired and every other session of the
 * account ends; the session asking stays. Returns how many other sessions ended.
 */
export async function changePassword(
  user: User,
  cookieHeader: string,
  input: z.infer<typeof passwordChangeSchema>,
  address: string,
): Promise<number> {
  try {
    await authenticate(user.email, input.currentPassword, address);
  } catch (e) {
    if (e instanceof AppError && e.status === 401) throw badRequest('The current password is not right.', 'currentPassword');
    throw e;
  }
  const keep = getLucia().readSessionCookie(cookieHeader);
  return setPasswordEndingOtherSessions(user.id, await hashPassword(input.newPassword), keep);
}

export async function signOut(cookieHeader: string): Promise<string> {
  return endSession(cookieHeader);
}

/**
 * Always answers the same way and in the same time (no hint whether the address has an
 * account): the token is made either way, and the rest — the limit check, storing the link
 * (which retires older ones) and the mail — happens in the background. When the address has an
 * account, a single-use link valid for one hour is mailed, at most MAIL_LIMITS.resetsPerAccount
 * within an hour (mail-limits.ts).
 */
export async function requestPasswordReset(email: string, origin: string, now = new Date()): Promise<void> {
  const user = await findUserByEmail(email);
  const token = newToken();
  const tokenHash = hashToken(token);
  if (!user) return;
  runInBackground('password-reset mail', async () => {
    if (!(await mayMailReset(user.id, now))) {
      console.warn(
        `[cavitas] password-reset mail for account ${user.id} not sent: ${MAIL_LIMITS.resetsPerAccount} links within the last hour`,
      );
      return;
    }
    await insertPasswordReset(user.id, tokenHash, new Date(now.getTime() + RESET_LIFETIME_MS), now);
    const link = `${origin}/reset-password?token=${encodeURIComponent(token)}`;
    await sendMail({
      to: user.email,
      subject: 'Cavitas: choose a new password',
      text:
        `Hello ${user.name},\n\nSomeone (hopefully you) asked to reset the password of your Cavitas account.\n` +
        `Open this link within one hour to choose a new one:\n\n${link}\n\n` +
        `The link works once, and only the newest link you were sent works. If you did not ask for it, ignore this ` +
        `message; your password stays as it is.\n`,
    });
  });
}

export async function resetPassword(token: string, password: string, now = new Date()): Promise<void> {
  await consumePasswordReset(hashToken(token), await hashPassword(password), now);
}
