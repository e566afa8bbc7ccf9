/**
 * Push tokens: shown once, stored hashed, refused when missing, unknown,
 * revoked or expired, and limited per window with a 429.
 */
import { createHash } from 'node:crypto';
import { afterAll, afterEach, beforeAll, describe, expect, it } from 'vitest';
import { closeDatabase, resetDatabase } from '@/test/helpers/db';
import { authenticatePush, hashSecret, issuePushToken, listPushTokens, revokePushToken } from '@/src/data/push-tokens';
import { getDb } from '@/db/client';
import { pushTokens } from '@/db/schema/stations';
import { eq } from 'drizzle-orm';
import { makeWorld } from './world';

beforeAll(resetDatabase);
afterAll(closeDatabase);
afterEach(() => {
  delete process.env.PUSH_RATE_PER_MINUTE;
});

describe('push tokens', () => {
  it('hashes secrets with SHA-256 (FIPS 180-2 B.1 test vector)', () => {
    expect(hashSecret('abc')).toBe('ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad');
  });

  it('shows the secret once and keeps only its hash', async () => {
    const w = await makeWorld();
    const { token, secret } = await issuePushToken(w.networkId, w.station.id, w.userId, { label: 'hut pc', expiresInDays: 30 });
    expect(secret).toMatch(/^cvs_[A-Za-z0-9_-]{43}$/);
    const [row] = await getDb().select().from(pushTokens).where(eq(pushTokens.id, token.id));
    expect(row.secretHash).toBe(createHash('sha256').update(secret).digest('hex'));
    expect(JSON.stringify(await listPushTokens(w.networkId, w.station.id))).not.toContain(secret.slice(8));
    const auth = await authenticatePush(`Bearer ${secret}`);
    expect(auth.stationId).toBe(w.station.id);
  });

  it('refuses missing, unknown, revoked and expired tokens with 401 and a code', async () => {
    const w = await makeWorld();
    await expect(authenticatePush(null)).rejects.toMatchObject({ status: 401, code: 'token_missing', field: 'authorization' });
    await expect(authenticatePush('Basic abc')).rejects.toMatchObject({ status: 401, code: 'token_missing' });
    await expect(authenticatePush('Bearer cvs_nope')).rejects.toMatchObject({ status: 401, code: 'token_unknown' });
    const a = await issuePushToken(w.networkId, w.station.id, w.userId, { label: 'a', expiresInDays: null });
    await revokePushToken(w.networkId, w.station.id, a.token.id);
    await expect(authenticatePush(`Bearer ${a.secret}`)).rejects.toMatchObject({ status: 401, code: 'token_revoked' });
    const b = await issuePushToken(w.networkId, w.station.id, w.userId, { label: 'b', expiresInDays: 1 });
    await getDb()
      .update(pushTokens)
      .set({ expiresAt: new Date(Date.now() - 1000) })
      .where(eq(pushTokens.id, b.token.id));
    await expect(authenticatePush(`Bearer ${b.secret}`)).rejects.toMatchObject({ status: 401, code: 'token_expired' });
  });

  it("cannot revoke another station's token", async () => {
    const w = await makeWorld();
    const other = await makeWorld();
    const t = await issuePushToken(w.networkId, w.station.id, w.userId, { label: 'a', expiresInDays: null });
    await expect(revokePushToken(other.networkId, other.station.id, t.token.id)).rejects.toMatchObject({ status: 404 });
  });

  it('answers 429 once the window is full', async () => {
    process.env.PUSH_RATE_PER_MINUTE = '3';
    const w = await makeWorld();
    const { secret } = await issuePushToken(w.networkId, w.station.id, w.userId, { label: 'a', expiresInDays: null });
    for (let i = 0; i < 3; i++) await authenticatePush(`Bearer ${secret}`);
    await expect(authenticatePush(`Bearer ${secret}`)).rejects.toMatchObject({ status: 429, code: 'throttled' });
  });
});
