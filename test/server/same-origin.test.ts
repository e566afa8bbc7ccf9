/**
 * Origin check for state-changing requests (OWASP CSRF Prevention Cheat Sheet, "verifying
 * origin with standard headers"; the `null` origin of sandboxed and opaque contexts is refused
 * as that sheet advises). Browsers send Origin on every non-GET request (Fetch standard).
 */
import { afterEach, describe, expect, it } from 'vitest';
import { assertSameOrigin } from '@/src/server/same-origin';
import { route } from '@/src/server/route';

const req = (method: string, headers: Record<string, string>) =>
  new Request('http://127.0.0.1:3000/api/networks', { method, headers: { host: '127.0.0.1:3000', ...headers } });
const refused = (method: string, headers: Record<string, string>) => {
  try {
    assertSameOrigin(req(method, headers));
    return false;
  } catch (e) {
    return (e as { status?: number }).status === 403;
  }
};

afterEach(() => {
  delete process.env.APP_URL;
});

describe('same-origin check', () => {
  it('refuses writes with Origin null, another site, or a malformed origin', () => {
    for (const method of ['POST', 'PUT', 'PATCH', 'DELETE']) {
      expect(refused(method, { origin: 'null' })).toBe(true);
      expect(refused(method, { origin: 'https://evil.example' })).toBe(true);
      expect(refused(method, { origin: 'http://127.0.0.1:3001' })).toBe(true); // another port is another origin (RFC 6454)
    }
    expect(refused('POST', { origin: 'not a url' })).toBe(true);
    expect(refused('POST', { origin: '' })).toBe(true);
  });

  it('refuses a write the browser marks as cross-site even without Origin', () => {
    expect(refused('POST', { 'sec-fetch-site': 'cross-site' })).toBe(true);
    expect(refused('POST', { 'sec-fetch-site': 'same-origin', origin: 'http://127.0.0.1:3000' })).toBe(false);
  });

  it('lets same-origin writes, writes without Origin (command line, station push) and reads pass', () => {
    expect(refused('POST', { origin: 'http://127.0.0.1:3000' })).toBe(false);
    expect(refused('POST', {})).toBe(false);
    expect(refused('GET', { origin: 'null' })).toBe(false);
    expect(refused('HEAD', { origin: 'https://evil.example' })).toBe(false);
  });

  it('behind a proxy: the public address (APP_URL) and the forwarded host count as this site', () => {
    process.env.APP_URL = 'https://elf.example.org';
    expect(refused('POST', { origin: 'https://elf.example.org' })).toBe(false);
    expect(
      refused('POST', {
        origin: 'https://proxy.example.org',
        'x-forwarded-host': 'proxy.example.org',
        'x-forwarded-proto': 'https',
      }),
    ).toBe(false);
    expect(refused('POST', { origin: 'http://elf.example.org' })).toBe(true); // scheme differs
  });

  it('route() answers a refused write with 403 in the one error shape, before the handler runs', async () => {
    let ran = false;
    const h = route(async () => {
      ran = true;
      return { ok: true };
    });
    const res = await h(req('POST', { origin: 'null' }));
    expect(res.status).toBe(403);
    expect((await res.json()).error).toEqual({
      code: 'forbidden',
      message: 'This request came from another site and was refused.',
    });
    expect(ran).toBe(false);
  });
});
