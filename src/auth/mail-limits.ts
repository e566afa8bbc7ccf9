/**
 * Limits on the mail the app sends on request, so that nobody can use it to
 * flood a mailbox: password-reset links per account and invitations per
 * sender, counted over a sliding hour from the rows already stored (each link
 * and each invitation is a row with its creation time), so no extra state is
 * kept. A reset over the limit is dropped silently (the answer must not tell
 * whether an address has an account); an invitation over the limit is refused
 * with the wait.
 */
import { invitationTimesSince } from '@/db/repo/networks';
import { resetTimesSince } from '@/db/repo/users';
import { tooManyRequests } from '@/src/server/errors';
import { describeWait } from './throttle';

export const MAIL_LIMITS = { resetsPerAccount: 3, invitationsPerSender: 20, windowMs: 60 * 60_000 } as const;

/** Pure: milliseconds until one more may be sent, or 0 when one may be sent now. */
export function waitBeforeNext(times: readonly Date[], allowance: number, now: Date, windowMs = MAIL_LIMITS.windowMs): number {
  const recent = times
    .filter((t) => now.getTime() - t.getTime() < windowMs)
    .map((t) => t.getTime())
    .sort((a, b) => a - b);
  if (recent.length < allowance) return 0;
  // The oldest of the last `allowance` sends must leave the window first.
  return recent[recent.length - allowance] + windowMs - now.getTime();
}

/** True when another reset link may be mailed to this account now. */
export async function mayMailReset(userId: string, now: Date): Promise<boolean> {
  const times = await resetTimesSince(userId, new Date(now.getTime() - MAIL_LIMITS.windowMs));
  return waitBeforeNext(times, MAIL_LIMITS.resetsPerAccount, now) === 0;
}

/** Throws 429 with the wait when this member has sent the hour's allowance of invitations. */
export async function assertMayInvite(userId: string, now: Date): Promise<void> {
  const times = await invitationTimesSince(userId, new Date(now.getTime() - MAIL_LIMITS.windowMs));
  const wait = waitBeforeNext(times, MAIL_LIMITS.invitationsPerSender, now);
  if (wait > 0) {
    throw tooManyRequests(
      `You have sent ${MAIL_LIMITS.invitationsPerSender} invitations within the last hour. Try again in ${describeWait(wait)}.`,
    );
  }
}
