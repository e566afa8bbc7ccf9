/**
 * Sign-in throttling policy (pure part): after the allowance, a wait that doubles per failure
 * up to a cap — exponential back-off as recommended for authentication throttling in
 * NIST SP 800-63B §5.2.2 ("rate limiting") and the OWASP Authentication Cheat Sheet
 * (common practice). Accounts wait at most a minute; client addresses at most fifteen.
 */
import { describe, expect, it } from 'vitest';
import { afterFailure, clientAddress, describeWait, isLocked, throttlePolicies, WINDOW_MS } from '@/src/auth/throttle';

const t0 = new Date('2026-03-01T12:00:00Z');
const at = (s: number) => new Date(t0.getTime() + s * 1000);
const { account, address } = throttlePolicies();

describe('throttle policy', () => {
  it('defaults: five failures per account, twenty per client address', () => {
    expect(account.allowance).toBe(5);
    expect(address.allowance).toBe(20);
  });

  it('an account: four failures free, then 5 s, doubling', () => {
    let row = undefined as ReturnType<typeof afterFailure> | undefined;
    for (let i = 1; i <= 4; i++) {
      row = afterFailure(row, 'account:a@example.org', at(i), account);
      expect(row.failures).toBe(i);
      expect(isLocked(row, at(i))).toBe(false);
    }
    row = afterFailure(row, 'account:a@example.org', at(5), account);
    expect(row.lockedUntil!.getTime() - at(5).getTime()).toBe(5_000);
    row = afterFailure(row, 'account:a@example.org', at(11), account);
    expect(row.lockedUntil!.getTime() - at(11).getTime()).toBe(10_000);
    row = afterFailure(row, 'account:a@example.org', at(30), account);
    expect(row.lockedUntil!.getTime() - at(30).getTime()).toBe(20_000);
  });

  it('an account never waits more than a minute (no long hard lock)', () => {
    let row = afterFailure(undefined, 'account:k', t0, account);
    for (let i = 0; i < 40; i++) row = afterFailure(row, 'account:k', t0, account);
    expect(row.lockedUntil!.getTime() - t0.getTime()).toBe(60_000);
  });

  it('a client address is held only after twenty failures, then 30 s doubling up to fifteen minutes', () => {
    let row = afterFailure(undefined, 'address:192.0.2.7', t0, address);
    for (let i = 2; i <= 19; i++) row = afterFailure(row, 'address:192.0.2.7', t0, address);
    expect(isLocked(row, t0)).toBe(false);
    row = afterFailure(row, 'address:192.0.2.7', t0, address);
    expect(row.failures).toBe(20);
    expect(row.lockedUntil!.getTime() - t0.getTime()).toBe(30_000);
    for (let i = 0; i < 30; i++) row = afterFailure(row, 'address:192.0.2.7', t0, address);
    expect(row.lockedUntil!.getTime() - t0.getTime()).toBe(15 * 60_000);
  });

  it('starts a fresh window once fifteen minutes pass without a wait', () => {
    let row = afterFailure(undefined, 'account:k', t0, account);
    row = afterFailure(row, 'account:k', at(60), account);
    row = afterFailure(row, 'account:k', new Date(t0.getTime() + WINDOW_MS + 1_000), account);
    expect(row.failures).toBe(1);
  });

  it('words the wait time, rounding up', () => {
    expect(describeWait(1)).toBe('1 second');
    expect(describeWait(29_001)).toBe('30 seconds');
    expect(describeWait(120_000)).toBe('2 minutes');
    expect(describeWait(14 * 60_000 + 1)).toBe('15 minutes');
  });
});

describe('client address', () => {
  const req = (h: Record<string, string>) => new Request('http://127.0.0.1/', { headers: h });

  it('served directly: the address Next.js put in X-Forwarded-For', () => {
    expect(clientAddress(req({ 'x-forwarded-for': '127.0.0.2' }))).toBe('127.0.0.2');
    expect(clientAddress(req({}))).toBe('unknown');
  });

  it('behind a trusted proxy: the hop the proxy appended (the last), not what the client wrote', () => {
    const before = process.env.TRUST_PROXY;
    process.env.TRUST_PROXY = 'true';
    try {
      expect(clientAddress(req({ 'x-forwarded-for': '203.0.113.9, 198.51.100.4' }))).toBe('198.51.100.4');
      expect(clientAddress(req({ 'x-real-ip': '198.51.100.5' }))).toBe('198.51.100.5');
    } finally {
      if (before === undefined) delete process.env.TRUST_PROXY;
      else process.env.TRUST_PROXY = before;
    }
  });
});
