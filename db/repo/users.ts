/**
 * Accounts, sessions, password-reset tokens, sign-in throttling rows and
 * instance settings. The only place with queries on these tables.
 */
import { and, asc, eq, gte, inArray, isNull, ne, sql } from 'drizzle-orm';
import { DrizzlePostgreSQLAdapter } from '@lucia-auth/adapter-drizzle';
import { getDb } from '../client';
import { instanceSettings, passwordResets, sessions, signInThrottle, users } from '../schema';
import { conflict, gone, notFound } from '@/src/server/errors';

export type UserRow = typeof users.$inferSelect;
export type ThrottleRow = typeof signInThrottle.$inferSelect;

/** The lucia session adapter over our users/sessions tables. */
export function sessionAdapter() {
  return new DrizzlePostgreSQLAdapter(getDb(), sessions, users);
}

/** Normal form of an e-mail address as stored. */
export function normalizeEmail(email: string): string {
  return email.trim().toLowerCase();
}

function isUniqueViolation(e: unknown): boolean {
  const code = (e as { code?: string; cause?: { code?: string } })?.code ?? (e as { cause?: { code?: string } })?.cause?.code;
  return code === '23505';
}

export interface NewUser {
  id: string;
  email: string;
  name: string;
  passwordHash: string;
  isAdmin?: boolean;
}

type Tx = Parameters<Parameters<ReturnType<typeof getDb>['transaction']>[0]>[0];
type Executor = ReturnType<typeof getDb> | Tx;

export async function insertUser(u: NewUser, db: Executor = getDb()): Promise<UserRow> {
  try {
    const [row] = await db
      .insert(users)
      .values({ ...u, email: normalizeEmail(u.email), isAdmin: u.isAdmin ?? false })
      .returning();
    return row;
  } catch (e) {
    if (isUniqueViolation(e)) throw conflict('An account with this e-mail address already exists. Sign in instead.', 'email');
    throw e;
  }
}

export async function findUserByEmail(email: string): Promise<UserRow | null> {
  const [row] = await getDb()
    .select()
    .from(users)
    .where(eq(users.email, normalizeEmail(email)));
  return row ?? null;
}

export async function getUserById(id: string): Promise<UserRow | null> {
  const [row] = await getDb().select().from(users).where(eq(users.id, id));
  return row ?? null;
}

export async function setUserAdmin(id: string, isAdmin: boolean): Promise<void> {
  await getDb().update(users).set({ isAdmin }).where(eq(users.id, id));
}

export async function updateUserPassword(id: string, passwordHash: string): Promise<void> {
  await getDb().update(users).set({ passwordHash }).where(eq(users.id, id));
}

/**
 * In one transaction: set a new password, retire every unused reset link of the account and end
 * its sessions except `keepSessionId` (the one asking). Returns how many sessions ended.
 */
export async function setPasswordEndingOtherSessions(
  userId: string,
  passwordHash: string,
  keepSessionId: string | null,
  now = new Date(),
): Promise<number> {
  return getDb().transaction(async (tx) => {
    await tx.update(users).set({ passwordHash }).where(eq(users.id, userId));
    await tx
      .update(passwordResets)
      .set({ usedAt: now })
      .where(and(eq(passwordResets.userId, userId), isNull(passwordResets.usedAt)));
    const ended = await tx
      .delete(sessions)
      .where(keepSessionId ? and(eq(sessions.userId, userId), ne(sessions.id, keepSessionId)) : eq(sessions.userId, userId))
      .returning({ id: sessions.id });
    return ended.length;
  });
}

export async function deleteUserSessions(userId: string): Promise<void> {
  await getDb().delete(sessions).where(eq(sessions.userId, userId));
}

// ── Password reset ───────────────────────────────────────────────────────────

/**
 * Store a new reset link and, in the same transaction, retire every older unused link of the
 * account (marked used), so only the newest link works.
 */
export async function insertPasswordReset(
  userId: string,
  tokenHash: string,
  expiresAt: Date,
  createdAt = new Date(),
): Promise<void> {
  await getDb().transaction(async (tx) => {
    await tx
      .update(passwordResets)
      .set({ usedAt: createdAt })
      .where(and(eq(passwordResets.userId, userId), isNull(passwordResets.usedAt)));
    await tx.insert(passwordResets).values({ userId, tokenHash, expiresAt, createdAt });
  });
}

/** When reset links were issued for an account since `since`, oldest first. */
export async function resetTimesSince(userId: string, since: Date): Promise<Date[]> {
  const rows = await getDb()
    .select({ t: passwordResets.createdAt })
    .from(passwordResets)
    .where(and(eq(passwordResets.userId, userId), gte(passwordResets.createdAt, since)))
    .orderBy(asc(passwordResets.createdAt));
  return rows.map((r) => r.t);
}

/**
 * In one transaction: check the token is known, unused and unexpired, mark it and every other
 * unused link of the account used, set the new password and end every session of the account.
 */
export async function consumePasswordReset(tokenHash: string, newPasswordHash: string, now: Date): Promise<string> {
  return getDb().transaction(async (tx) => {
    const [row] = await tx.select().from(passwordResets).where(eq(passwordResets.tokenHash, tokenHash)).for('update');
    if (!row || row.usedAt) throw notFound('This reset link is unknown or was already used. Ask for a new one.');
    if (row.expiresAt.getTime() <= now.getTime()) throw gone('This reset link has expired. Ask for a new one.');
    await tx
      .update(passwordResets)
      .set({ usedAt: now })
      .where(and(eq(passwordResets.userId, row.userId), isNull(passwordResets.usedAt)));
    await tx.update(users).set({ passwordHash: newPasswordHash }).where(eq(users.id, row.userId));
    await tx.delete(sessions).where(eq(sessions.userId, row.userId));
    return row.userId;
  });
}

export async function findPasswordReset(tokenHash: string) {
  const [row] = await getDb()
    .select()
    .from(passwordResets)
    .where(and(eq(passwordResets.tokenHash, tokenHash), isNull(passwordResets.usedAt)));
  return row ?? null;
}

// ── Sign-in throttling ───────────────────────────────────────────────────────

export async function getThrottleRows(keys: string[]): Promise<ThrottleRow[]> {
  if (keys.length === 0) return [];
  return getDb().select().from(signInThrottle).where(inArray(signInThrottle.key, keys));
}

/**
 * Change one throttle row atomically: the row is created if missing (no failures) and locked
 * (SELECT … FOR UPDATE) while `next` computes its new state, so parallel failures queue up
 * instead of overwriting each other.
 */
export async function bumpThrottleRow(
  key: string,
  now: Date,
  next: (prev: ThrottleRow | undefined) => ThrottleRow,
): Promise<ThrottleRow> {
  return getDb().transaction(async (tx) => {
    await tx.insert(signInThrottle).values({ key, failures: 0, firstFailureAt: now, lockedUntil: null }).onConflictDoNothing();
    const [prev] = await tx.select().from(signInThrottle).where(eq(signInThrottle.key, key)).for('update');
    const row = next(prev && prev.failures > 0 ? prev : undefined);
    await tx
      .update(signInThrottle)
      .set({ failures: row.failures, firstFailureAt: row.firstFailureAt, lockedUntil: row.lockedUntil })
      .where(eq(signInThrottle.key, key));
    return row;
  });
}

export async function clearThrottleRows(keys: string[]): Promise<void> {
  if (keys.length === 0) return;
  await getDb().delete(signInThrottle).where(inArray(signInThrottle.key, keys));
}

// ── Instance settings ────────────────────────────────────────────────────────

export async function readSettings(): Promise<Record<string, unknown>> {
  const rows = await getDb().select().from(instanceSettings);
  return Object.fromEntries(rows.map((r) => [r.key, r.value]));
}

export async function writeSettings(values: Record<string, unknown>): Promise<void> {
  const db = getDb();
  await db.transaction(async (tx) => {
    for (const [key, value] of Object.entries(values)) {
      await tx
        .insert(instanceSettings)
        .values({ key, value })
        .onConflictDoUpdate({ target: instanceSettings.key, set: { value, updatedAt: sql`now()` } });
    }
  });
}

/**
 * The stored value of `key`; when there is none yet, `value` is stored and returned. Concurrent
 * callers all get the one value that was stored first.
 */
export async function readOrCreateSetting(key: string, value: unknown): Promise<unknown> {
  const db = getDb();
  await db.insert(instanceSettings).values({ key, value }).onConflictDoNothing({ target: instanceSettings.key });
  const [row] = await db.select().from(instanceSettings).where(eq(instanceSettings.key, key));
  return row.value;
}

export async function countUsers(): Promise<number> {
  const [row] = await getDb()
    .select({ n: sql<number>`count(*)::int` })
    .from(users);
  return row.n;
}
