/**
 * Limits on requested mail (pure part): a sliding one-hour window over the
 * times already sent; the next send waits until the oldest of the last
 * `allowance` sends leaves the window. Rate limiting of account-recovery and
 * other mail-sending requests is recommended by the OWASP Forgot Password
 * Cheat Sheet (common practice).
 */
import { describe, expect, it } from 'vitest';
import { MAIL_LIMITS, waitBeforeNext } from '@/src/auth/mail-limits';

const t0 = new Date('2026-03-01T12:00:00Z');
const at = (min: number) => new Date(t0.getTime() + min * 60_000);

describe('mail limits', () => {
  it('lets the allowance through within the hour, then gives the wait until the oldest leaves the window', () => {
    const sent = [at(0), at(10), at(20)];
    expect(waitBeforeNext(sent.slice(0, 2), 3, at(25))).toBe(0);
    expect(waitBeforeNext(sent, 3, at(25))).toBe(35 * 60_000);
    expect(waitBeforeNext(sent, 3, at(59.5))).toBe(0.5 * 60_000);
    expect(waitBeforeNext(sent, 3, at(60))).toBe(0);
  });

  it('counts only the last `allowance` sends and ignores older ones in any order', () => {
    const sent = [at(30), at(-120), at(5), at(50), at(-61)];
    // Within the hour before at(55): 5, 30, 50 → three; the oldest of them (5) leaves at 65.
    expect(waitBeforeNext(sent, 3, at(55))).toBe(10 * 60_000);
    expect(waitBeforeNext(sent, 2, at(55))).toBe(35 * 60_000);
  });

  it('has the documented defaults', () => {
    expect(MAIL_LIMITS).toEqual({ resetsPerAccount: 3, invitationsPerSender: 20, windowMs: 3_600_000 });
  });
});
