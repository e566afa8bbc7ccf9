/**
 * Link tokens: the database keeps SHA-256(token) only. Checked against the
 * FIPS 180-2 Appendix B.1 test vector SHA-256("abc").
 */
import { describe, expect, it } from 'vitest';
import { hashToken, newToken } from '@/src/auth/tokens';

describe('link tokens', () => {
  it('hashes with SHA-256 (FIPS 180-2 B.1: "abc")', () => {
    expect(hashToken('abc')).toBe('ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad');
  });

  it('draws 256 random bits, URL-safe (RFC 4648 §5 base64url, 43 characters unpadded)', () => {
    const seen = new Set(Array.from({ length: 200 }, () => newToken()));
    expect(seen.size).toBe(200);
    for (const t of seen) expect(t).toMatch(/^[A-Za-z0-9_-]{43}$/);
  });
});
