/**
 * The built app as a hostile visitor meets it: security headers on pages and API answers (and
 * no X-Powered-By), writes with a `null` or foreign Origin refused while same-origin writes
 * work, sign-in failures from one loopback address (127.0.0.2) holding up neither another
 * address nor real accounts, and — in a real browser — every page used here working under the
 * Content-Security-Policy, with no violation reported (theme script, hydration, the run page's
 * figures).
 */
import http from 'node:http';
import { randomUUID } from 'node:crypto';
import { describe, expect, it } from 'vitest';
import { signInAs, useBrowserApp } from './harness';
import { demoNetworkId } from '@/src/ops/seed/accounts';
import { DEMO_RUN } from '@/src/ops/seed/runs';
import { listRuns } from '@/db/repo/runs';
import { clearThrottleRows, insertUser } from '@/db/repo/users';
import { hashPassword } from '@/src/auth/password';

/** POST JSON from a chosen local source address (all of 127.0.0.0/8 is loopback, RFC 1122 §3.2.1.3). */
function postFrom(
  url: string,
  body: unknown,
  localAddress: string,
  headers: Record<string, string> = {},
): Promise<{ status: number; headers: http.IncomingHttpHeaders; text: string }> {
  return new Promise((resolve, reject) => {
    const data = JSON.stringify(body);
    const r = http.request(
      url,
      {
        method: 'POST',
        localAddress,
        headers: { 'content-type': 'application/json', 'content-length': Buffer.byteLength(data), ...headers },
      },
      (res) => {
        let text = '';
        res.setEncoding('utf8');
        res.on('data', (c) => (text += c));
        res.on('end', () => resolve({ status: res.statusCode!, headers: res.headers, text }));
      },
    );
    r.on('error', reject);
    r.end(data);
  });
}

describe('security at the edge of the running app', () => {
  const env = useBrowserApp();

  it('pages and API answers carry the security headers; X-Powered-By is gone', async () => {
    const page = await fetch(`${env.app.baseUrl}/sign-in`);
    expect(page.status).toBe(200);
    const csp = page.headers.get('content-security-policy')!;
    expect(csp).toMatch(/script-src 'self' 'nonce-[A-Za-z0-9+/=]+' 'strict-dynamic'/);
    expect(csp).toMatch(/frame-ancestors 'none'/);
    const nonce = csp.match(/'nonce-([^']+)'/)![1];
    expect(await page.text()).toContain(`nonce="${nonce}"`); // Next.js and the layout stamp their scripts
    const again = await fetch(`${env.app.baseUrl}/sign-in`);
    expect(again.headers.get('content-security-policy')).not.toBe(csp); // a new nonce per request
    for (const res of [page, await fetch(`${env.app.baseUrl}/api/auth/session`)]) {
      expect(res.headers.get('x-content-type-options')).toBe('nosniff');
      expect(res.headers.get('referrer-policy')).toBe('strict-origin-when-cross-origin');
      expect(res.headers.get('x-frame-options')).toBe('DENY');
      expect(res.headers.get('x-powered-by')).toBeNull();
      expect(res.headers.get('strict-transport-security')).toBeNull(); // plain http on loopback
    }
  });

  it('refuses writes with Origin null or another site; same-origin writes work', async () => {
    const signOut = `${env.app.baseUrl}/api/auth/sign-out`;
    for (const origin of ['null', 'https://elsewhere.example']) {
      const res = await fetch(signOut, { method: 'POST', headers: { origin } });
      expect(res.status).toBe(403);
      expect((await res.json()).error.code).toBe('forbidden');
    }
    const same = await fetch(signOut, { method: 'POST', headers: { origin: env.app.baseUrl } });
    expect(same.status).toBe(200);
  });

  it('thirty failed sign-ins from one address, for unknown and real accounts, keep nobody else out', async () => {
    const email = `target-${randomUUID()}@example.org`;
    const password = 'target-long-pass-7';
    await insertUser({ id: `t-${randomUUID()}`, email, name: 'Target', passwordHash: await hashPassword(password) });
    const url = `${env.app.baseUrl}/api/auth/sign-in`;
    try {
      const statuses: number[] = [];
      for (let i = 0; i < 30; i++) {
        const who = i % 2 ? `nobody-${i}-${randomUUID()}@example.org` : email;
        statuses.push((await postFrom(url, { email: who, password: 'wrong-password-x' }, '127.0.0.2')).status);
      }
      expect(statuses.slice(0, 20).every((s) => s === 401 || s === 429)).toBe(true);
      const held = await postFrom(url, { email, password }, '127.0.0.2');
      expect(held.status).toBe(429);
      expect(Number(held.headers['retry-after'])).toBeGreaterThan(0);
      // Another address: a demo user signs in at once.
      const viewer = env.app.signIns.find((s) => s.role === 'viewer')!;
      const other = await postFrom(url, { email: viewer.email, password: viewer.password }, '127.0.0.1');
      expect(other.status, other.text).toBe(200);
      // The targeted real account waits at most a minute (a short back-off, not a long lock).
      const target = await postFrom(url, { email, password }, '127.0.0.3');
      if (target.status === 429) expect(Number(target.headers['retry-after'])).toBeLessThanOrEqual(60);
      else expect(target.status).toBe(200);
    } finally {
      await clearThrottleRows(['address:127.0.0.2', 'address:127.0.0.3', `account:${email}`]);
    }
  });

  it('the app works in the browser under its Content-Security-Policy, run figures included', async () => {
    const networkId = await demoNetworkId();
    const run = (await listRuns(networkId)).find((r) => r.name === DEMO_RUN)!;
    const context = await env.browser.newContext({ viewport: { width: 1400, height: 1000 } });
    await context.addInitScript(() => {
      const w = window as unknown as { __csp: string[] };
      w.__csp = [];
      document.addEventListener('securitypolicyviolation', (e) => w.__csp.push(`${e.violatedDirective} ${e.blockedURI}`));
    });
    const page = await context.newPage();
    const problems: string[] = [];
    page.on('pageerror', (e) => problems.push(e.message));
    page.on('console', (m) => {
      if (/Content Security Policy/i.test(m.text())) problems.push(m.text());
    });
    const violations = () => page.evaluate(() => (window as unknown as { __csp: string[] }).__csp);

    const viewer = env.app.signIns.find((s) => s.role === 'viewer')!;
    await signInAs(page, env.app.baseUrl, viewer); // a client-side form: needs hydrated scripts
    expect(await violations()).toEqual([]);
    for (const path of [`/n/${networkId}`, `/n/${networkId}/runs`, `/n/${networkId}/stations`]) {
      const res = await page.goto(env.app.baseUrl + path);
      expect(res?.status()).toBe(200);
      await page.waitForLoadState('networkidle');
      expect(await violations(), path).toEqual([]);
    }
    await page.goto(`${env.app.baseUrl}/n/${networkId}/runs/${run.id}`);
    await page
      .locator('svg title', { hasText: 'Source regions of the selected minimum' })
      .waitFor({ state: 'attached', timeout: 60_000 });
    await page.waitForLoadState('networkidle');
    expect(await page.locator('svg').count()).toBeGreaterThan(2);
    expect(await violations()).toEqual([]);
    expect(problems).toEqual([]);
    await context.close();
  }, 300_000);
});
