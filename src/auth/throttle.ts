/**
 * Sign-in throttling, per account and per client address, kept in PostgreSQL.
 * Five failures for an account (twenty for an address, which many people may
 * share) within fifteen minutes lock the key; each further failure doubles
 * the lock (30 s, 60 s, 120 s …) up to fifteen minutes.
 */
import { clearThrottleRows, getThrottleRows, saveThrottleRow, type ThrottleRow } from '@/db/repo/users';
import { tooManyRequests } from '@/src/server/errors';
import { settings } from '@/src/settings';

export const THROTTLE = {
  allowance: 5,
  addressAllowance: 20,
  windowMs: 15 * 60_000,
  baseLockMs: 30_000,
  maxLockMs: 15 * 60_000,
} as const;

/** Pure: the row after one more failure at `now`. */
export function afterFailure(prev: ThrottleRow | undefined, key: string, now: Date): ThrottleRow {
  const stale = !prev || (now.getTime() - prev.firstFailureAt.getTime() > THROTTLE.windowMs && !isLocked(prev, now));
  const failures = stale ? 1 : prev!.failures + 1;
  const firstFailureAt = stale ? now : prev!.firstFailureAt;
  const over = failures - (key.startsWith('address:') ? THROTTLE.addressAllowance : THROTTLE.allowance);
  const lockedUntil = over >= 0 ? new Date(now.getTime() + Math.min(THROTTLE.maxLockMs, THROTTLE.baseLockMs * 2 ** over)) : null;
  return { key, failures, firstFailureAt, lockedUntil };
}

export function isLocked(row: ThrottleRow | undefined, now: Date): boolean {
  return !!row?.lockedUntil && row.lockedUntil.getTime() > now.getTime();
}

/** "45 seconds", "2 minutes" — rounded up. */
export function describeWait(ms: number): string {
  const s = Math.max(1, Math.ceil(ms / 1000));
  if (s < 90) return `${s} second${s === 1 ? '' : 's'}`;
  const m = Math.ceil(s / 60);
  return `${m} minute${m === 1 ? '' : 's'}`;
}

export function throttleKeys(email: string, address: string): string[] {
  return [`account:${email.trim().toLowerCase()}`, `address:${address}`];
}

/** Throw 429 with the wait time when any key is locked. */
export async function assertNotThrottled(keys: string[], now: Date): Promise<void> {
  const rows = await getThrottleRows(keys);
  const locked = rows.filter((r) => isLocked(r, now));
  if (locked.length === 0) return;
  const until = Math.max(...locked.map((r) => r.lockedUntil!.getTime()));
  const what = locked.some((r) => r.key.startsWith('account:')) ? 'this account' : 'this address';
  throw tooManyRequests(`Too many failed sign-ins for ${what}. Try again in ${describeWait(until - now.getTime())}.`);
}

export async function recordFailure(keys: string[], now: Date): Promise<void> {
  const rows = await getThrottleRows(keys);
  for (const key of keys)
    await saveThrottleRow(
      afterFailure(
        rows.find((r) => r.key === key),
        key,
        now,
      ),
    );
}

export async function clearAccountThrottle(email: string): Promise<void> {
  await clearThrottleRows([`account:${email.trim().toLowerCase()}`]);
}

/**
 * Client address for throttling. Behind a reverse proxy (TRUST_PROXY=true) it
 * is the first X-Forwarded-For hop, else X-Real-IP; otherwise the headers could
 * be forged by the client, and all direct callers share the key "local".
 */
export function clientAddress(req: Request): string {
  if (!settings().TRUST_PROXY) return 'local';
  const fwd = req.headers.get('x-forwarded-for');
  if (fwd) return fwd.split(',')[0].trim();
  return req.headers.get('x-real-ip')?.trim() || 'local';
}
