/** The one id pattern: UUIDs as PostgreSQL's gen_random_uuid and Node's randomUUID write them (RFC 9562). */
import { randomUUID } from 'node:crypto';
import { describe, expect, it } from 'vitest';
import { isId, requireId } from '@/src/server/ids';
import { AppError } from '@/src/server/errors';

describe('ids', () => {
  it("accepts UUIDs from Node's generator, in either case", () => {
    for (let i = 0; i < 20; i++) {
      const id = randomUUID();
      expect(isId(id)).toBe(true);
      expect(isId(id.toUpperCase())).toBe(true);
    }
  });

  it('refuses what cannot name a stored row', () => {
    for (const s of ['', 'latest', '123', `${randomUUID()}x`, randomUUID().replaceAll('-', ''), '../etc/passwd'])
      expect(isId(s)).toBe(false);
  });

  it('turns a malformed id in an address into a 404 naming what was asked for', () => {
    const e = (() => {
      try {
        requireId('nope', 'station');
      } catch (x) {
        return x;
      }
    })();
    expect(e).toBeInstanceOf(AppError);
    expect((e as AppError).status).toBe(404);
    expect((e as AppError).message).toBe('No station has this address.');
  });
});
