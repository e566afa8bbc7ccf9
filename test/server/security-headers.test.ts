/**
 * The security headers (MDN and OWASP HTTP Headers Cheat Sheet, common practice): a nonce-based
 * script policy ('strict-dynamic', CSP Level 3), frame-ancestors 'none', nosniff, a referrer
 * policy, and HSTS only over https (RFC 6797 §7.2: not over plain http).
 */
import { describe, expect, it } from 'vitest';
import { API_POLICY, commonSecurityHeaders, newNonce, pagePolicy } from '@/src/server/security-headers';

describe('security headers', () => {
  it('gives each request a new nonce of 128 random bits', () => {
    const a = newNonce();
    expect(Buffer.from(a, 'base64')).toHaveLength(16);
    expect(newNonce()).not.toBe(a);
  });

  it('lets scripts run only with the nonce, forbids framing and plugins', () => {
    const p = pagePolicy('abc123', { dev: false, https: false });
    const d = Object.fromEntries(p.split('; ').map((x) => [x.split(' ')[0], x.split(' ').slice(1).join(' ')]));
    expect(d['script-src']).toBe("'self' 'nonce-abc123' 'strict-dynamic'");
    expect(d['frame-ancestors']).toBe("'none'");
    expect(d['object-src']).toBe("'none'");
    expect(d['default-src']).toBe("'self'");
    expect(p).not.toMatch(/unsafe-eval/);
    expect(p).not.toMatch(/upgrade-insecure-requests/);
    expect(pagePolicy('n', { dev: true, https: false })).toMatch(/'unsafe-eval'/);
    expect(pagePolicy('n', { dev: false, https: true })).toMatch(/upgrade-insecure-requests$/);
    expect(API_POLICY).toBe("default-src 'none'; frame-ancestors 'none'");
  });

  it('sends nosniff, a referrer policy and DENY framing always, HSTS only over https', () => {
    const http = commonSecurityHeaders(false);
    expect(http).toEqual({
      'x-content-type-options': 'nosniff',
      'referrer-policy': 'strict-origin-when-cross-origin',
      'x-frame-options': 'DENY',
    });
    expect(commonSecurityHeaders(true)['strict-transport-security']).toBe('max-age=63072000; includeSubDomains');
  });
});
