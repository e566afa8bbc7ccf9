/**
 * Networks, memberships and invitations. Multi-step writes run in one
 * transaction; the last-owner rule is enforced here under a row lock.
 */
import { and, asc, eq, gt, gte, isNull, sql } from 'drizzle-orm';
import { getDb } from '../client';
import { invitations, memberships, networks, users } from '../schema';
import { conflict, forbidden, gone, notFound } from '@/src/server/errors';
import { insertUser, normalizeEmail, type NewUser } from './users';

export type Role = 'owner' | 'analyst' | 'viewer';
export type NetworkRow = typeof networks.$inferSelect;
export type InvitationRow = typeof invitations.$inferSelect;

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;
export function isUuid(s: string): boolean {
  return UUID.test(s);
}

export interface MembershipInfo {
  networkId: string;
  networkName: string;
  userId: string;
  role: Role;
}

export interface MyNetwork {
  id: string;
  name: string;
  role: Role;
  memberCount: number;
  createdAt: Date;
}

export interface MemberEntry {
  userId: string;
  name: string;
  email: string;
  role: Role;
  joinedAt: Date;
}

export async function createNetwork(name: string, ownerId: string): Promise<NetworkRow> {
  return getDb().transaction(async (tx) => {
    const [net] = await tx.insert(networks).values({ name, createdBy: ownerId }).returning();
    await tx.insert(memberships).values({ networkId: net.id, userId: ownerId, role: 'owner' });
    return net;
  });
}

export async function getNetwork(id: string): Promise<NetworkRow | null> {
  if (!isUuid(id)) return null;
  const [row] = await getDb().select().from(networks).where(eq(networks.id, id));
  return row ?? null;
}

export async function renameNetwork(id: string, name: string): Promise<NetworkRow> {
  const [row] = await getDb().update(networks).set({ name }).where(eq(networks.id, id)).returning();
  if (!row) throw notFound('This network does not exist.');
  return row;
}

export async function listNetworksForUser(userId: string): Promise<MyNetwork[]> {
  const memberCount = sql<number>`(select count(*)::int from ${memberships} m2 where m2.network_id = ${networks.id})`;
  return getDb()
    .select({ id: networks.id, name: networks.name, role: memberships.role, memberCount, createdAt: networks.createdAt })
    .from(memberships)
    .innerJoin(networks, eq(memberships.networkId, networks.id))
    .where(eq(memberships.userId, userId))
    .orderBy(asc(networks.name));
}

export async function getMembership(networkId: string, userId: string): Promise<MembershipInfo | null> {
  if (!isUuid(networkId)) return null;
  const [row] = await getDb()
    .select({ networkId: memberships.networkId, networkName: networks.name, userId: memberships.userId, role: memberships.role })
    .from(memberships)
    .innerJoin(networks, eq(memberships.networkId, networks.id))
    .where(and(eq(memberships.networkId, networkId), eq(memberships.userId, userId)));
  return row ?? null;
}

export async function listMembers(networkId: string): Promise<MemberEntry[]> {
  return getDb()
    .select({ userId: users.id, name: users.name, email: users.email, role: memberships.role, joinedAt: memberships.createdAt })
    .from(memberships)
    .innerJoin(users, eq(memberships.userId, users.id))
    .where(eq(memberships.networkId, networkId))
    .orderBy(asc(users.name));
}

type Tx = Parameters<Parameters<ReturnType<typeof getDb>['transaction']>[0]>[0];

/** Lock the network's memberships and return the owner count and the target's row. */
async function lockMembers(tx: Tx, networkId: string, userId: string) {
  const rows = await tx.select().from(memberships).where(eq(memberships.networkId, networkId)).for('update');
  const target = rows.find((r) => r.userId === userId);
  if (!target) throw notFound('This person is not a member of the network.');
  return { owners: rows.filter((r) => r.role === 'owner').length, target };
}

const LAST_OWNER = 'A network needs at least one owner: make someone else an owner first.';

export async function changeMemberRole(networkId: string, userId: string, role: Role): Promise<void> {
  await getDb().transaction(async (tx) => {
    const { owners, target } = await lockMembers(tx, networkId, userId);
    if (target.role === 'owner' && role !== 'owner' && owners <= 1) throw conflict(LAST_OWNER, 'role');
    await tx
      .update(memberships)
      .set({ role })
      .where(and(eq(memberships.networkId, networkId), eq(memberships.userId, userId)));
  });
}

export async function removeMember(networkId: string, userId: string): Promise<void> {
  await getDb().transaction(async (tx) => {
    const { owners, target } = await lockMembers(tx, networkId, userId);
    if (target.role === 'owner' && owners <= 1) throw conflict(LAST_OWNER);
    await tx.delete(memberships).where(and(eq(memberships.networkId, networkId), eq(memberships.userId, userId)));
  });
}

// ── Invitations ──────────────────────────────────────────────────────────────

export interface NewInvitation {
  networkId: string;
  email: string;
  role: Role;
  tokenHash: string;
  invitedBy: string;
  expiresAt: Date;
  createdAt?: Date;
}

/** When a member sent invitations (in any network) since `since`, oldest first. */
export async function invitationTimesSince(invitedBy: string, since: Date): Promise<Date[]> {
  const rows = await getDb()
    .select({ t: invitations.createdAt })
    .from(invitations)
    .where(and(eq(invitations.invitedBy, invitedBy), gte(invitations.createdAt, since)))
    .orderBy(asc(invitations.createdAt));
  return rows.map((r) => r.t);
}

/** Refuses existing members; replaces (revokes) an earlier open invitation to the same address. */
export async function createInvitation(inv: NewInvitation): Promise<InvitationRow> {
  const email = normalizeEmail(inv.email);
  return getDb().transaction(async (tx) => {
    const [member] = await tx
      .select({ userId: users.id })
      .from(memberships)
      .innerJoin(users, eq(memberships.userId, users.id))
      .where(and(eq(memberships.networkId, inv.networkId), eq(users.email, email)));
    if (member) throw conflict(`${email} is already a member of this network.`, 'email');
    await tx
      .update(invitations)
      .set({ revokedAt: new Date() })
      .where(
        and(
          eq(invitations.networkId, inv.networkId),
          eq(invitations.email, email),
          isNull(invitations.acceptedAt),
          isNull(invitations.revokedAt),
        ),
      );
    const [row] = await tx
      .insert(invitations)
      .values({ ...inv, email })
      .returning();
    return row;
  });
}

export async function listOpenInvitations(networkId: string, now: Date) {
  return getDb()
    .select({
      id: invitations.id,
      email: invitations.email,
      role: invitations.role,
      expiresAt: invitations.expiresAt,
      createdAt: invitations.createdAt,
    })
    .from(invitations)
    .where(
      and(
        eq(invitations.networkId, networkId),
        isNull(invitations.acceptedAt),
        isNull(invitations.revokedAt),
        gt(invitations.expiresAt, now),
      ),
    )
    .orderBy(asc(invitations.createdAt));
}

export async function revokeInvitation(networkId: string, invitationId: string): Promise<void> {
  if (!isUuid(invitationId)) throw notFound('This invitation does not exist.');
  const rows = await getDb()
    .update(invitations)
    .set({ revokedAt: new Date() })
    .where(
      and(
        eq(invitations.id, invitationId),
        eq(invitations.networkId, networkId),
        isNull(invitations.acceptedAt),
        isNull(invitations.revokedAt),
      ),
    )
    .returning({ id: invitations.id });
  if (rows.length === 0) throw notFound('This invitation does not exist or was already used or withdrawn.');
}

export interface InvitationView {
  id: string;
  networkId: string;
  networkName: string;
  email: string;
  role: Role;
  expiresAt: Date;
  hasAccount: boolean;
}

function checkOpen(row: InvitationRow | undefined, now: Date): InvitationRow {
  if (!row || row.revokedAt) throw notFound('This invitation is unknown or was withdrawn. Ask the network owner for a new one.');
  if (row.acceptedAt) throw gone('This invitation has already been used.');
  if (row.expiresAt.getTime() <= now.getTime())
    throw gone('This invitation has expired. Ask the network owner to send a new one.');
  return row;
}

export async function findOpenInvitation(tokenHash: string, now: Date): Promise<InvitationView> {
  const [found] = await getDb()
    .select({ inv: invitations, networkName: networks.name })
    .from(invitations)
    .innerJoin(networks, eq(invitations.networkId, networks.id))
    .where(eq(invitations.tokenHash, tokenHash));
  const inv = checkOpen(found?.inv, now);
  const [acct] = await getDb().select({ id: users.id }).from(users).where(eq(users.email, inv.email));
  return {
    id: inv.id,
    networkId: inv.networkId,
    networkName: found.networkName,
    email: inv.email,
    role: inv.role,
    expiresAt: inv.expiresAt,
    hasAccount: !!acct,
  };
}

/**
 * Accept in one transaction: re-check the invitation under a row lock, create
 * the account when `newUser` is given, add the membership, mark it used.
 * An existing account must carry the invited address.
 */
export async function acceptInvitation(
  tokenHash: string,
  who: { userId: string; email: string } | { newUser: NewUser },
  now: Date,
): Promise<{ networkId: string; userId: string; role: Role }> {
  return getDb().transaction(async (tx) => {
    const [row] = await tx.select().from(invitations).where(eq(invitations.tokenHash, tokenHash)).for('update');
    const inv = checkOpen(row, now);
    let userId: string;
    if ('newUser' in who) {
      const u = await insertUser({ ...who.newUser, email: inv.email }, tx);
      userId = u.id;
    } else {
      if (normalizeEmail(who.email) !== inv.email)
        throw forbidden(
          `This invitation was sent to ${inv.email}, but you are signed in as ${who.email}. Sign out and accept it with the invited address.`,
        );
      userId = who.userId;
    }
    const [existing] = await tx
      .select()
      .from(memberships)
      .where(and(eq(memberships.networkId, inv.networkId), eq(memberships.userId, userId)));
    if (existing) throw conflict('You are already a member of this network.');
    await tx.insert(memberships).values({ networkId: inv.networkId, userId, role: inv.role });
    await tx.update(invitations).set({ acceptedAt: now, acceptedBy: userId }).where(eq(invitations.id, inv.id));
    return { networkId: inv.networkId, userId, role: inv.role };
  });
}

/** Used by the demo seeder: add or update a membership directly. */
export async function upsertMembership(networkId: string, userId: string, role: Role): Promise<void> {
  await getDb()
    .insert(memberships)
    .values({ networkId, userId, role })
    .onConflictDoUpdate({ target: [memberships.networkId, memberships.userId], set: { role } });
}

export async function findNetworkByName(name: string): Promise<NetworkRow | null> {
  const [row] = await getDb().select().from(networks).where(eq(networks.name, name));
  return row ?? null;
}
