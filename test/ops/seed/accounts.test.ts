/**
 * Demo accounts seeder: idempotent (a second run changes nothing), every demo
 * password is at least 10 characters and works, roles are as announced.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { closeDatabase, resetDatabase } from '@/test/helpers/db';
import { DEMO_SIGN_INS, demoNetworkId, seed } from '@/src/ops/seed/accounts';
import { countUsers, findUserByEmail } from '@/db/repo/users';
import { getMembership, listMembers } from '@/db/repo/networks';
import { verifyPassword } from '@/src/auth/password';

beforeAll(async () => {
  await resetDatabase();
});
afterAll(async () => {
  await closeDatabase();
});

describe('accounts seeder', () => {
  it('creates an administrator, owner, analyst and viewer once, however often it runs', async () => {
    await seed();
    const id = await demoNetworkId();
    const users1 = await countUsers();
    await seed();
    expect(await countUsers()).toBe(users1);
    expect(await demoNetworkId()).toBe(id);
    expect((await listMembers(id)).map((m) => m.role).sort()).toEqual(['analyst', 'owner', 'viewer']);
  });

  it('every demo sign-in works with its printed password, and roles match', async () => {
    const id = await demoNetworkId();
    for (const s of DEMO_SIGN_INS) {
      expect(s.password.length).toBeGreaterThanOrEqual(10);
      const u = (await findUserByEmail(s.email))!;
      expect(await verifyPassword(u.passwordHash, s.password)).toBe(true);
      if (s.role === 'administrator') {
        expect(u.isAdmin).toBe(true);
        expect(await getMembership(id, u.id)).toBeNull();
      } else {
        expect((await getMembership(id, u.id))?.role).toBe(s.role);
      }
    }
  });
});
