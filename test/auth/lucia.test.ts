/**
 * When the session cookie carries the Secure attribute (RFC 6265 §4.1.2.5):
 * whenever the public address (APP_URL) is https; in production without APP_URL;
 * COOKIE_SECURE=true/false overrides both.
 */
import { describe, expect, it } from 'vitest';
import { cookieSecure } from '@/src/settings';

const env = (e: Record<string, string>) => e as unknown as NodeJS.ProcessEnv;

describe('cookieSecure', () => {
  it('is on in production by default', () => expect(cookieSecure(env({ NODE_ENV: 'production' }))).toBe(true));
  it('is off in production with COOKIE_SECURE=false', () =>
    expect(cookieSecure(env({ NODE_ENV: 'production', COOKIE_SECURE: 'false' }))).toBe(false));
  it('is off in development and tests', () => expect(cookieSecure(env({ NODE_ENV: 'development' }))).toBe(false));
  it('follows an https public address, in any mode', () => {
    expect(cookieSecure(env({ NODE_ENV: 'production', APP_URL: 'https://elf.example.org' }))).toBe(true);
    expect(cookieSecure(env({ NODE_ENV: 'development', APP_URL: 'https://elf.example.org' }))).toBe(true);
  });
  it('is off for a plain-http public address (npm start on loopback)', () =>
    expect(cookieSecure(env({ NODE_ENV: 'production', APP_URL: 'http://127.0.0.1:3000' }))).toBe(false));
  it('can be forced on', () => expect(cookieSecure(env({ NODE_ENV: 'development', COOKIE_SECURE: 'true' }))).toBe(true));
});
