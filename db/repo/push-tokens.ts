/**
 * Per-station push tokens. Only a SHA-256 of each secret is stored; the rate
 * window (count per fixed window) lives on the token row and is advanced
 * atomically by one UPDATE.
 */
import { and, desc, eq, sql } from 'drizzle-orm';
import { getDb } from '../client';
import { pushTokens, stations } from '../schema/stations';

export type PushTokenRow = typeof pushTokens.$inferSelect;
/** What may be shown about a token after creation (never the hash). */
export type PushTokenInfo = Omit<PushTokenRow, 'secretHash' | 'windowStartedAt' | 'windowCount'>;

function info(r: PushTokenRow): PushTokenInfo {
  const { secretHash: _h, windowStartedAt: _w, windowCount: _c, ...rest } = r;
  return rest;
}

export async function createPushToken(v: {
  networkId: string;
  stationId: string;
  label: string;
  secretHash: string;
  hint: string;
  createdBy: string | null;
  expiresAt: Date | null;
}): Promise<PushTokenInfo> {
  const [row] = await getDb().insert(pushTokens).values(v).returning();
  return info(row);
}

export async function listPushTokens(networkId: string, stationId: string): Promise<PushTokenInfo[]> {
  const rows = await getDb()
    .select()
    .from(pushTokens)
    .where(and(eq(pushTokens.networkId, networkId), eq(pushTokens.stationId, stationId)))
    .orderBy(desc(pushTokens.createdAt));
  return rows.map(info);
}

/** Revokes a token; null when it is not this station's. Revoking twice keeps the first time. */
export async function revokePushToken(networkId: string, stationId: string, tokenId: string): Promise<PushTokenInfo | null> {
  const [row] = await getDb()
    .update(pushTokens)
    .set({ revokedAt: sql`coalesce(${pushTokens.revokedAt}, now())` })
    .where(and(eq(pushTokens.id, tokenId), eq(pushTokens.networkId, networkId), eq(pushTokens.stationId, stationId)))
    .returning();
  return row ? info(row) : null;
}

/** The token with this secret hash and its station's code, or null. */
export async function findPushTokenByHash(secretHash: string): Promise<(PushTokenInfo & { stationCode: string }) | null> {
  const [row] = await getDb()
    .select({ t: pushTokens, code: stations.code })
    .from(pushTokens)
    .innerJoin(stations, eq(stations.id, pushTokens.stationId))
    .where(eq(pushTokens.secretHash, secretHash));
  return row ? { ...info(row.t), stationCode: row.code } : null;
}

/**
 * Counts one request against the token's window (a fixed window of
 * `windowSeconds` seconds) and returns the count including this request and
 * the seconds until the window resets.
 */
export async function countPushRequest(tokenId: string, windowSeconds: number): Promise<{ count: number; resetInS: number }> {
  const fresh = sql`${pushTokens.windowStartedAt} <= now() - make_interval(secs => ${windowSeconds}::float8)`;
  const [row] = await getDb()
    .update(pushTokens)
    .set({
      windowStartedAt: sql`case when ${fresh} then now() else ${pushTokens.windowStartedAt} end`,
      windowCount: sql`case when ${fresh} then 1 else ${pushTokens.windowCount} + 1 end`,
      lastUsedAt: sql`now()`,
    })
    .where(eq(pushTokens.id, tokenId))
    .returning({
      count: pushTokens.windowCount,
      resetInS: sql<number>`greatest(0, extract(epoch from (${pushTokens.windowStartedAt} + make_interval(secs => ${windowSeconds}::float8) - now())))::float8`,
    });
  return { count: row?.count ?? 0, resetInS: Number(row?.resetInS ?? windowSeconds) };
}
