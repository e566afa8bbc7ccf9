/**
 * Network repository against a real PostgreSQL: the last-owner rule holds
 * under concurrency (row locks, SELECT … FOR UPDATE — PostgreSQL manual
 * §13.3.2 "Row-Level Locks"), a new invitation replaces an open one to the
 * same address, and "my networks" reports role and member count.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { closeDatabase, resetDatabase } from '@/test/helpers/db';
import { makeUser } from '@/test/helpers/authz';
import {
  changeMemberRole,
  createInvitation,
  createNetwork,
  listMembers,
  listNetworksForUser,
  listOpenInvitations,
  removeMember,
  upsertMembership,
  getMembership,
} from '@/db/repo/networks';
import { hashToken, newToken } from '@/src/auth/tokens';

beforeAll(async () => {
  await resetDatabase();
});
afterAll(async () => {
  await closeDatabase();
});

describe('networks repository', () => {
  it('two owners demoting each other at once: exactly one succeeds, one owner remains', async () => {
    const a = await makeUser('Ownera', 'repo1');
    const b = await makeUser('Ownerb', 'repo1');
    const net = await createNetwork('Concurrent owners', a.userId);
    await upsertMembership(net.id, b.userId, 'owner');
    const results = await Promise.allSettled([
      changeMemberRole(net.id, a.userId, 'viewer'),
      changeMemberRole(net.id, b.userId, 'viewer'),
    ]);
    expect(results.filter((r) => r.status === 'fulfilled')).toHaveLength(1);
    const owners = (await listMembers(net.id)).filter((m) => m.role === 'owner');
    expect(owners).toHaveLength(1);
  });

  it('two owners removing each other at once leave one owner', async () => {
    const a = await makeUser('Ownerc', 'repo2');
    const b = await makeUser('Ownerd', 'repo2');
    const net = await createNetwork('Concurrent removal', a.userId);
    await upsertMembership(net.id, b.userId, 'owner');
    await Promise.allSettled([removeMember(net.id, a.userId), removeMember(net.id, b.userId)]);
    expect((await listMembers(net.id)).filter((m) => m.role === 'owner')).toHaveLength(1);
  });

  it('a second invitation to the same address replaces the open one', async () => {
    const o = await makeUser('Ownere', 'repo3');
    const net = await createNetwork('Invites', o.userId);
    const base = { networkId: net.id, role: 'viewer' as const, invitedBy: o.userId, expiresAt: new Date(Date.now() + 3600_000) };
    await createInvitation({ ...base, email: 'Twice@Example.org', tokenHash: hashToken(newToken()) });
    await createInvitation({ ...base, email: 'twice@example.org', role: 'analyst', tokenHash: hashToken(newToken()) });
    const open = await listOpenInvitations(net.id, new Date());
    expect(open.map((i) => [i.email, i.role])).toEqual([['twice@example.org', 'analyst']]);
  });

  it('lists my networks with my role and the member count; a missing or malformed id is no membership', async () => {
    const o = await makeUser('Ownerf', 'repo4');
    const v = await makeUser('Viewerf', 'repo4');
    const net = await createNetwork('Counted', o.userId);
    await upsertMembership(net.id, v.userId, 'viewer');
    const mine = await listNetworksForUser(v.userId);
    expect(mine.map((n) => [n.name, n.role, n.memberCount])).toEqual([['Counted', 'viewer', 2]]);
    expect(await getMembership('not-a-uuid', v.userId)).toBeNull();
    expect(await getMembership('00000000-0000-4000-8000-000000000000', v.userId)).toBeNull();
  });
});
