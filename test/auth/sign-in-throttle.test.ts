/**
 * Sign-in throttling through the route, with PostgreSQL: parallel failures are all counted
 * (row lock, no lost update), failures for unknown e-mail addresses and from one client address
 * never keep anyone else out, and a wait is answered 429 with Retry-After.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { closeDatabase, resetDatabase } from '@/test/helpers/db';
import { call, errorOf, makeUser, TEST_PASSWORD } from '@/test/helpers/authz';
import { getThrottleRows } from '@/db/repo/users';
import { recordFailure } from '@/src/auth/throttle';
import * as signIn from '@/app/api/auth/sign-in/route';

const from = (address: string, body: unknown) => ({ method: 'POST', body, headers: { 'x-forwarded-for': address } });
const failures = async (key: string) => (await getThrottleRows([key]))[0]?.failures ?? 0;

beforeAll(resetDatabase);
afterAll(closeDatabase);

describe('sign-in throttling', () => {
  it('counts thirty failures recorded at once, every one', async () => {
    const now = new Date();
    await Promise.all(Array.from({ length: 30 }, () => recordFailure(['account:race@example.org', 'address:192.0.2.30'], now)));
    expect(await failures('account:race@example.org')).toBe(30);
    expect(await failures('address:192.0.2.30')).toBe(30);
  });

  it('thirty parallel wrong passwords: each is either counted (401) or refused while waiting (429)', async () => {
    const u = await makeUser('Parallel', 'throttle');
    const res = await Promise.all(
      Array.from({ length: 30 }, () =>
        call(signIn.POST, null, from('192.0.2.31', { email: u.email, password: 'wrong-password-x' })),
      ),
    );
    const statuses = res.map((r) => r.status);
    const counted = statuses.filter((s) => s === 401).length;
    expect(counted + statuses.filter((s) => s === 429).length).toBe(30);
    expect(counted).toBeGreaterThanOrEqual(5);
    expect(await failures(`account:${u.email}`)).toBe(counted);
    expect(await failures('address:192.0.2.31')).toBe(counted);
  }, 120_000);

  it('thirty failures from one address, for unknown and for real accounts, keep out neither another address nor the real owner', async () => {
    const victim = await makeUser('Victim', 'throttle');
    const bystander = await makeUser('Bystander', 'throttle');
    for (let i = 0; i < 30; i++) {
      const email = i % 2 ? `nobody-${i}@example.org` : victim.email;
      const r = await call(signIn.POST, null, from('198.51.100.66', { email, password: 'wrong-password-x' }));
      expect([401, 429]).toContain(r.status);
    }
    // The noisy address now waits, with Retry-After …
    const held = await call(signIn.POST, null, from('198.51.100.66', { email: bystander.email, password: TEST_PASSWORD }));
    expect(held.status).toBe(429);
    expect(Number(held.headers.get('retry-after'))).toBeGreaterThanOrEqual(1);
    expect((await errorOf(held)).message).toMatch(/from this address\. Try again in/);
    // … another address is not held up at all, for the bystander nor for anyone else.
    const other = await call(signIn.POST, null, from('203.0.113.5', { email: bystander.email, password: TEST_PASSWORD }));
    expect(other.status).toBe(200);
    // Unknown e-mail addresses counted only under their own keys.
    expect(await failures('account:nobody-1@example.org')).toBe(1);
    // The victim's account waits at most a minute, then signs in from its own address.
    const acct = (await getThrottleRows([`account:${victim.email}`]))[0];
    expect(acct.lockedUntil!.getTime() - Date.now()).toBeLessThanOrEqual(60_000);
  });

  it('an account past its allowance answers 429 with Retry-After for a short wait, and the right password works after it', async () => {
    const u = await makeUser('Waiting', 'throttle');
    for (let i = 0; i < 5; i++) {
      const r = await call(signIn.POST, null, from('192.0.2.50', { email: u.email, password: 'wrong-password-x' }));
      expect(r.status).toBe(401);
    }
    const wait = await call(signIn.POST, null, from('192.0.2.51', { email: u.email, password: TEST_PASSWORD }));
    expect(wait.status).toBe(429);
    expect(wait.headers.get('retry-after')).toBe('5');
    expect((await errorOf(wait)).message).toMatch(/for this account\. Try again in 5 seconds/);
    await new Promise((r) => setTimeout(r, 5_200));
    const ok = await call(signIn.POST, null, from('192.0.2.51', { email: u.email, password: TEST_PASSWORD }));
    expect(ok.status).toBe(200);
    expect(await failures(`account:${u.email}`)).toBe(0); // a success clears the account's count
  }, 30_000);
});
