/**
 * Account operations behind the auth routes: sign up, sign in (throttled),
 * sign out, password reset by e-mail. Each returns what the route needs,
 * including the Set-Cookie value when a session starts or ends.
 */
import { z } from 'zod';
import { generateIdFromEntropySize } from 'lucia';
import {
  findUserByEmail,
  insertUser,
  insertPasswordReset,
  consumePasswordReset,
  normalizeEmail,
  type UserRow,
} from '@/db/repo/users';
import { forbidden, unauthorized } from '@/src/server/errors';
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

export async function signUp(input: z.infer<typeof signUpSchema>): Promise<{ user: User; cookie: string }> {
  const settings = await getInstanceSettings();
  if (!settings.openSignUp) throw forbidden('New accounts on this instance need an invitation from a network owner.');
  const row = await insertUser({
    id: newUserId(),
    email: input.email,
    name: input.name,
    passwordHash: await hashPassword(input.password),
  });
  return { user: publicUser(row), cookie: await startSession(row.id) };
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

export async function signOut(cookieHeader: string): Promise<string> {
  return endSession(cookieHeader);
}

/**
 * Always answers the same way (no hint whether the address has an account);
 * when it has one, a single-use link valid for one hour is mailed — at most
 * MAIL_LIMITS.resetsPerAccount within an hour (mail-limits.ts).
 */
export async function requestPasswordReset(email: string, origin: string, now = new Date()): Promise<void> {
  const user = await findUserByEmail(email);
  if (!user) return;
  if (!(await mayMailReset(user.id, now))) {
    console.warn(
      `[cavitas] password-reset mail for account ${user.id} not sent: ${MAIL_LIMITS.resetsPerAccount} links within the last hour`,
    );
    return;
  }
  const token = newToken();
  await insertPasswordReset(user.id, hashToken(token), new Date(now.getTime() + RESET_LIFETIME_MS), now);
  const link = `${origin}/reset-password?token=${encodeURIComponent(token)}`;
  try {
    await sendMail({
      to: user.email,
      subject: 'Cavitas: choose a new password',
      text:
        `Hello ${user.name},\n\nSomeone (hopefully you) asked to reset the password of your Cavitas account.\n` +
        `Open this link within one hour to choose a new one:\n\n${link}\n\n` +
        `The link works once. If you did not ask for it, ignore this message; your password stays as it is.\n`,
    });
  } catch (e) {
    console.error('[cavitas] password-reset mail could not be sent', e);
  }
}

export async function resetPassword(token: string, password: string, now = new Date()): Promise<void> {
  await consumePasswordReset(hashToken(token), await hashPassword(password), now);
}
