/**
 * The settings module: defaults when a variable is unset or empty, the value when it is well
 * formed, and an error naming the variable when it is not (a typo must not silently become the
 * default, nor a nonsense value reach the code).
 */
import { describe, expect, it } from 'vitest';
import { childEnv, databaseUrl, mailRelay, settings } from '@/src/settings';

describe('settings', () => {
  it('gives the documented defaults for an empty environment', () => {
    const s = settings({});
    expect(s.DATABASE_POOL).toBe(10);
    expect(s.PORT).toBe(3000);
    expect(s.SMTP_HOST).toBe('127.0.0.1');
    expect(s.SMTP_PORT).toBe(2525);
    expect(s.SMTP_SECURE).toBe(false);
    expect(s.UPLOAD_MAX_MB).toBe(200);
    expect(s.PUSH_RATE_PER_MINUTE).toBe(120);
    expect(s.WORKER_CONCURRENCY).toBe(1);
    expect(s.CAVITAS_RUN_LEASE_S).toBe(30);
    expect(s.CAVITAS_RUN_SWEEP_S).toBe(30);
    expect(s.CAVITAS_RUN_SLICE_S).toBe(300);
    expect(s.CAVITAS_RUN_CHUNK).toBe(6);
    expect(s.CAVITAS_RUN_WRITE_MS).toBeUndefined();
    expect(s.CAVITAS_RUN_THREADS).toBeUndefined();
    expect(s.APP_URL).toBeUndefined();
    expect(s.TRUST_PROXY).toBe(false);
  });

  it('treats empty and blank values as unset', () => {
    expect(settings({ CAVITAS_RUN_WRITE_MS: ' ', PORT: '' })).toMatchObject({ CAVITAS_RUN_WRITE_MS: undefined, PORT: 3000 });
  });

  it('reads well-formed values, 0 included where 0 is allowed', () => {
    const s = settings({ CAVITAS_RUN_WRITE_MS: '0', CAVITAS_RUN_LEASE_S: '3', UPLOAD_MAX_MB: '0.01', TRUST_PROXY: 'true' });
    expect(s.CAVITAS_RUN_WRITE_MS).toBe(0);
    expect(s.CAVITAS_RUN_LEASE_S).toBe(3);
    expect(s.UPLOAD_MAX_MB).toBe(0.01);
    expect(s.TRUST_PROXY).toBe(true);
    expect(settings({ APP_URL: 'https://cavitas.example.org//' }).APP_URL).toBe('https://cavitas.example.org');
  });

  it('refuses malformed values with an error naming each variable', () => {
    expect(() => settings({ CAVITAS_RUN_WRITE_MS: 'soon' })).toThrow(/CAVITAS_RUN_WRITE_MS="soon"/);
    expect(() => settings({ CAVITAS_RUN_WRITE_MS: '-5' })).toThrow(/CAVITAS_RUN_WRITE_MS="-5" must be 0 or more/);
    expect(() => settings({ CAVITAS_RUN_LEASE_S: '0' })).toThrow(/CAVITAS_RUN_LEASE_S="0" must be greater than 0/);
    expect(() => settings({ PORT: '70000' })).toThrow(/PORT="70000"/);
    expect(() => settings({ WORKER_CONCURRENCY: '1.5' })).toThrow(/WORKER_CONCURRENCY="1.5" must be a whole number/);
    expect(() => settings({ CAVITAS_RUN_CHUNK: '0' })).toThrow(/CAVITAS_RUN_CHUNK="0" must be at least 1/);
    expect(() => settings({ TRUST_PROXY: 'maybe' })).toThrow(/TRUST_PROXY="maybe" must be true or false/);
    expect(() => settings({ APP_URL: 'cavitas' })).toThrow(/APP_URL="cavitas"/);
    expect(() => settings({ PORT: 'x', SMTP_PORT: 'y' })).toThrow(/PORT="x".*SMTP_PORT="y"/);
  });

  it('says how to get a database when DATABASE_URL is missing', () => {
    expect(() => databaseUrl({})).toThrow(/DATABASE_URL is not set/);
    expect(databaseUrl({ DATABASE_URL: 'postgres://u@127.0.0.1:5432/d' })).toBe('postgres://u@127.0.0.1:5432/d');
  });

  it('tells the local catcher from a relay', () => {
    expect(mailRelay({})).toBe(false);
    expect(mailRelay({ SMTP_HOST: 'localhost' })).toBe(false);
    expect(mailRelay({ SMTP_HOST: 'smtp.example.org' })).toBe(true);
  });

  it('builds a child environment: overrides on top, undefined removes, NODE_ENV dropped on request', () => {
    const env = childEnv({ CAVITAS_TEST_CHILD: 'x', PATH: undefined }, { dropNodeEnv: true });
    expect(env.CAVITAS_TEST_CHILD).toBe('x');
    expect('PATH' in env).toBe(false);
    expect('NODE_ENV' in env).toBe(false);
  });
});
