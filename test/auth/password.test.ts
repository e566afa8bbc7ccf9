/**
 * Password hashing: argon2id with the OWASP Password Storage Cheat Sheet
 * minimum parameters, encoded as a PHC string (RFC 9106 §5 names argon2id
 * the recommended variant; the "$argon2id$v=19$m=…,t=…,p=…$salt$hash"
 * layout is the PHC string format used by the reference implementation).
 */
import { describe, expect, it } from 'vitest';
import { hashPassword, passwordSchema, verifyPassword } from '@/src/auth/password';

describe('argon2id password hashing', () => {
  it('produces a PHC string for argon2id v=19 with m=19456 KiB, t=2, p=1 and a fresh salt', async () => {
    const a = await hashPassword('correct horse battery');
    const b = await hashPassword('correct horse battery');
    expect(a).toMatch(/^\$argon2id\$v=19\$m=19456,t=2,p=1\$[A-Za-z0-9+/]{22}\$[A-Za-z0-9+/]{43}$/);
    expect(a).not.toBe(b); // random 16-byte salt each time
  });

  it('verifies the right password and rejects a wrong one or a malformed hash', async () => {
    const h = await hashPassword('harbour-lantern-77');
    expect(await verifyPassword(h, 'harbour-lantern-77')).toBe(true);
    expect(await verifyPassword(h, 'harbour-lantern-78')).toBe(false);
    expect(await verifyPassword('not-a-hash', 'harbour-lantern-77')).toBe(false);
  });

  it('asks for at least 10 characters with a message that says so', () => {
    const r = passwordSchema.safeParse('nine-char');
    expect(r.success).toBe(false);
    expect(r.error?.issues[0].message).toMatch(/at least 10 characters/);
    expect(passwordSchema.safeParse('ten-chars!').success).toBe(true);
  });
});
