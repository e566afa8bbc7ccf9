/**
 * When the session cookie carries the Secure attribute (RFC 6265 §4.1.2.5):
 * always in production, unless the operator serves plain http on loopback
 * and says so with COOKIE_SECURE=false; COOKIE_SECURE=true forces it.
 */
import { describe, expect, it } from 'vitest';
import { cookieSecure } from '@/src/settings';

const env = (e: Record<string, string>) => e as unknown as NodeJS.ProcessEnv;

describe('cookieSecure', () => {
  it('is on in production by default', () => expect(cookieSecure(env({ NODE_ENV: 'production' }))).toBe(true));
  it('is off in production with COOKIE_SECURE=false', () =>
    expect(cookieSecure(env({ NODE_ENV: 'production', COOKIE_SECURE: 'false' }))).toBe(false));
  it('is off in development and tests', () => expect(cookieSecure(env({ NODE_ENV: 'development' }))).toBe(false));
  it('can be forced on', () => expect(cookieSecure(env({ NODE_ENV: 'development', COOKIE_SECURE: 'true' }))).toBe(true));
});
