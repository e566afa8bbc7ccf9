/**
 * Sign-in throttling policy (pure part): five failures inside fifteen minutes
 * lock the key, then the lock doubles per failure up to fifteen minutes —
 * exponential back-off as recommended for authentication throttling in
 * NIST SP 800-63B §5.2.2 ("rate limiting") and the OWASP Authentication
 * Cheat Sheet (common practice).
 */
import { describe, expect, it } from 'vitest';
import { afterFailure, describeWait, isLocked, THROTTLE } from '@/src/auth/throttle';

const t0 = new Date('2026-03-01T12:00:00Z');
const at = (s: number) => new Date(t0.getTime() + s * 1000);

describe('throttle policy', () => {
  it('allows four failures, locks on the fifth for 30 s, then doubles', () => {
    let row = undefined as ReturnType<typeof afterFailure> | undefined;
    for (let i = 1; i <= 4; i++) {
      row = afterFailure(row, 'account:a@example.org', at(i));
      expect(row.failures).toBe(i);
      expect(isLocked(row, at(i))).toBe(false);
    }
    row = afterFailure(row, 'account:a@example.org', at(5));
    expect(row.lockedUntil!.getTime() - at(5).getTime()).toBe(30_000);
    row = afterFailure(row, 'account:a@example.org', at(40));
    expect(row.lockedUntil!.getTime() - at(40).getTime()).toBe(60_000);
    row = afterFailure(row, 'account:a@example.org', at(110));
    expect(row.lockedUntil!.getTime() - at(110).getTime()).toBe(120_000);
  });

  it('caps the lock at fifteen minutes', () => {
    let row = afterFailure(undefined, 'k', t0);
    for (let i = 0; i < 30; i++) row = afterFailure(row, 'k', t0);
    expect(row.lockedUntil!.getTime() - t0.getTime()).toBe(THROTTLE.maxLockMs);
  });

  it('starts a fresh window once fifteen minutes pass without a lock', () => {
    let row = afterFailure(undefined, 'k', t0);
    row = afterFailure(row, 'k', at(60));
    row = afterFailure(row, 'k', at(16 * 60));
    expect(row.failures).toBe(1);
    expect(row.firstFailureAt).toEqual(at(16 * 60));
  });

  it('words the wait time, rounding up', () => {
    expect(describeWait(1)).toBe('1 second');
    expect(describeWait(29_001)).toBe('30 seconds');
    expect(describeWait(120_000)).toBe('2 minutes');
    expect(describeWait(14 * 60_000 + 1)).toBe('15 minutes');
  });
});

describe('per-address allowance', () => {
  it('an address (shared by many people) is locked only after twenty failures', () => {
    let row = afterFailure(undefined, 'address:192.0.2.7', t0);
    for (let i = 2; i <= 19; i++) row = afterFailure(row, 'address:192.0.2.7', t0);
    expect(isLocked(row, t0)).toBe(false);
    row = afterFailure(row, 'address:192.0.2.7', t0);
    expect(row.failures).toBe(20);
    expect(isLocked(row, t0)).toBe(true);
  });
});
