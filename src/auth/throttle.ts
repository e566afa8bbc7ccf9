/**
 * Sign-in throttling, per account and per client address, counted in PostgreSQL.
 *
 * Each failed sign-in adds one to two counters: the e-mail address tried (`account:<email>`,
 * whether or not an account has it, so the answer never tells) and the client address
 * (`address:<ip>`). Each counter is changed under a row lock (db/repo/users.ts
 * `bumpThrottleRow`), so parallel attempts are all counted. Past its allowance within the
 * window, a counter asks for a wait that doubles per further failure (exponential back-off,
 * NIST SP 800-63B §5.2.2 and the OWASP Authentication Cheat Sheet, common practice):
 *
 * - an account waits 5 s, 10 s … at most one minute — short, so that nobody can keep an owner
 *   out of their own account for long;
 * - a client address waits 30 s, 60 s … at most fifteen minutes — it holds up only that address.
 *
 * A counter for one e-mail address or one client address never holds up another, so failures
 * for unknown e-mail addresses cannot lock a real account, and one busy address cannot lock out
 * everyone else. The wait is answered as 429 with Retry-After.
 */
import { bumpThrottleRow, clearThrottleRows, getThrottleRows, type ThrottleRow } from '@/db/repo/users';
import { tooManyRequests } from '@/src/server/errors';
import { settings } from '@/src/settings';

export interface ThrottlePolicy {
  /** Failures within the window before any wait. */
  allowance: number;
  /** First wait; doubled per further failure. */
  baseDelayMs: number;
  maxDelayMs: number;
}

export const WINDOW_MS = 15 * 60_000;

/** The two policies; the allowances come from the settings (SIGN_IN_ACCOUNT_ALLOWANCE, SIGN_IN_ADDRESS_ALLOWANCE). */
export function throttlePolicies(): { account: ThrottlePolicy; address: ThrottlePolicy } {
  const s = settings();
  return {
    account: { allowance: s.SIGN_IN_ACCOUNT_ALLOWANCE, baseDelayMs: 5_000, maxDelayMs: 60_000 },
    address: { allowance: s.SIGN_IN_ADDRESS_ALLOWANCE, baseDelayMs: 30_000, maxDelayMs: 15 * 60_000 },
  };
}

function policyFor(key: string): ThrottlePolicy {
  const p = throttlePolicies();
  return key.startsWith('address:') ? p.address : p.account;
}

export function isLocked(row: ThrottleRow | undefined, now: Date): boolean {
  return !!row?.lockedUntil && row.lockedUntil.getTime() > now.getTime();
}

/** Pure: the row after one more failure at `now`. A row with no failures counts as none. */
export function afterFailure(prev: ThrottleRow | undefined, key: string, now: Date, policy: ThrottlePolicy): ThrottleRow {
  const fresh =
    !prev || prev.failures === 0 || (now.getTime() - prev.firstFailureAt.getTime() > WINDOW_MS && !isLocked(prev, now));
  const failures = fresh ? 1 : prev!.failures + 1;
  const firstFailureAt = fresh ? now : prev!.firstFailureAt;
  const over = failures - policy.allowance;
  const lockedUntil = over >= 0 ? new Date(now.getTime() + Math.min(policy.maxDelayMs, policy.baseDelayMs * 2 ** over)) : null;
  return { key, failures, firstFailureAt, lockedUntil };
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

/** Throw 429 with the wait (message and Retry-After) when any key must wait. */
export async function assertNotThrottled(keys: string[], now: Date): Promise<void> {
  const rows = await getThrottleRows(keys);
  const locked = rows.filter((r) => isLocked(r, now));
  if (locked.length === 0) return;
  const until = Math.max(...locked.map((r) => r.lockedUntil!.getTime()));
  const what = locked.some((r) => r.key.startsWith('address:')) ? 'from this address' : 'for this account';
  throw tooManyRequests(
    `Too many failed sign-ins ${what}. Try again in ${describeWait(until - now.getTime())}.`,
    (until - now.getTime()) / 1000,
  );
}

/** Count one failure on every key, each atomically. */
export async function recordFailure(keys: string[], now: Date): Promise<ThrottleRow[]> {
  const out: ThrottleRow[] = [];
  for (const key of keys) {
    const policy = policyFor(key);
    out.push(await bumpThrottleRow(key, now, (prev) => afterFailure(prev, key, now, policy)));
  }
  return out;
}

export async function clearAccountThrottle(email: string): Promise<void> {
  await clearThrottleRows([`account:${email.trim().toLowerCase()}`]);
}

/**
 * Client address for throttling. Behind a reverse proxy (TRUST_PROXY=true) it is the last
 * X-Forwarded-For hop — the one the proxy itself appended — else X-Real-IP. Served directly,
 * Next.js fills X-Forwarded-For with the socket's address; `npm start` listens on loopback only,
 * so direct callers are local processes.
 */
export function clientAddress(req: Request): string {
  const fwd = req.headers
    .get('x-forwarded-for')
    ?.split(',')
    .map((s) => s.trim())
    .filter(Boolean);
  if (settings().TRUST_PROXY) return fwd?.at(-1) || req.headers.get('x-real-ip')?.trim() || 'unknown';
  return fwd?.[0] || 'unknown';
}
