/**
 * Station push through the route handler: bearer token, one interval per
 * request, idempotent on (station, component, start), error shape on bad input.
 */
import { createHash } from 'node:crypto';
import { afterAll, afterEach, beforeAll, describe, expect, it } from 'vitest';
import { closeDatabase, resetDatabase } from '@/test/helpers/db';
import { listIntervals, getIntervalSpectra } from '@/db/repo/intervals';
import { issuePushToken, revokePushToken } from '@/src/data/push-tokens';
import { POST } from '@/app/api/v1/push/intervals/route';
import { makeWorld } from './world';
import { synthesize, TEST_MODES } from './series-maker';

beforeAll(resetDatabase);
afterAll(closeDatabase);
afterEach(() => {
  delete process.env.PUSH_RATE_PER_MINUTE;
});

const FS = 100;
const push = (secret: string | null, body: unknown) =>
  POST(
    new Request('http://cavitas.test/api/v1/push/intervals', {
      method: 'POST',
      headers: { 'content-type': 'application/json', ...(secret ? { authorization: `Bearer ${secret}` } : {}) },
      body: typeof body === 'string' ? body : JSON.stringify(body),
    }),
  );

async function setup() {
  const w = await makeWorld({ sampleRateHz: FS });
  const { secret, token } = await issuePushToken(w.networkId, w.station.id, w.userId, { label: 'hut pc', expiresInDays: 30 });
  return { ...w, secret, tokenId: token.id };
}

const white = (sigma: number, seed: number) => Array.from(synthesize({ kind: 'white', sigma, unit: 'raw' }, 600 * FS, FS, seed));

describe('push', () => {
  it('stores an interval once, however often it is sent', async () => {
    const w = await setup();
    const body = { startsAt: '2026-03-14T06:20:00Z', sampleRateHz: FS, components: { Ez: white(4, 1), Bns: white(3, 2) } };
    const a = await push(w.secret, body);
    expect(a.status).toBe(201);
    const out = await a.json();
    expect(out.intervals.map((i: { created: boolean }) => i.created)).toEqual([true, true]);
    const b = await push(w.secret, body);
    expect(b.status).toBe(200);
    expect((await b.json()).intervals.map((i: { created: boolean }) => i.created)).toEqual([false, false]);
    const rows = await listIntervals({ networkId: w.networkId });
    expect(rows).toHaveLength(2);
    expect(rows.every((r) => r.origin === 'push')).toBe(true);
    // Ez raw units through the station's flat gain 2 per V/m: P = 2 sigma^2 / fs / gain^2 (Parseval)
    const ez = (await getIntervalSpectra({ networkId: w.networkId, components: ['Ez'] }))[0];
    const level = ez.power.reduce((s, v) => s + v, 0) / ez.power.length;
    expect(level / ((2 * 16) / FS / 4)).toBeGreaterThan(0.96);
    expect(level / ((2 * 16) / FS / 4)).toBeLessThan(1.04);
  });

  it('refuses the same interval with other samples (409 naming it and the stored checksum), keeps the first', async () => {
    const w = await setup();
    const first = white(4, 11);
    const body = { startsAt: '2026-03-14T08:00:00Z', sampleRateHz: FS, components: { Ez: first } };
    expect((await push(w.secret, body)).status).toBe(201);
    const other = await push(w.secret, { ...body, components: { Ez: white(4, 12) } });
    expect(other.status).toBe(409);
    const err = (await other.json()).error;
    // SHA-256 (FIPS 180-4) of the float64 samples, little-endian, as Node's crypto gives it.
    const stored = createHash('sha256')
      .update(Buffer.from(new Float64Array(first).buffer))
      .digest('hex');
    expect(err).toMatchObject({ code: 'conflict', field: 'components.Ez' });
    expect(err.message).toContain('TST1 Ez 2026-03-14T08:00:00.000Z');
    expect(err.message).toContain(`stored checksum sha256:${stored}`);
    // The same samples again: 200, nothing changed.
    const same = await push(w.secret, body);
    expect(same.status).toBe(200);
    expect((await same.json()).intervals).toMatchObject([{ component: 'Ez', created: false, samplesSha256: stored }]);
    expect(await listIntervals({ networkId: w.networkId })).toHaveLength(1);
  });

  it("stores with each fit the bins it left out: the station's listed line", async () => {
    // The test station lists 16.65 Hz here; with the default 0.3 Hz notch half-width that is the 0.1 Hz bins
    // 16.4–16.9 Hz (|f - 16.65| <= 0.3, worked by hand).
    const w = await makeWorld({ sampleRateHz: FS, interferenceLines: [{ frequencyHz: 16.65, label: 'railway supply' }] });
    const { secret } = await issuePushToken(w.networkId, w.station.id, w.userId, { label: 'hut pc', expiresInDays: 30 });
    const ez = Array.from(synthesize({ kind: 'modes', modes: TEST_MODES, floor: 0.3, unit: 'raw' }, 600 * FS, FS, 5));
    expect((await push(secret, { startsAt: '2026-03-14T07:00:00Z', sampleRateHz: FS, components: { Ez: ez } })).status).toBe(201);
    const [row] = await listIntervals({ networkId: w.networkId });
    expect(row.fit).not.toBeNull();
    expect(row.fit!.excluded!.map((r) => [r.minHz, r.maxHz].map((v) => Math.round(v * 10) / 10))).toEqual([[16.4, 16.9]]);
  });

  it('answers bad bodies with the error shape naming the field', async () => {
    const w = await setup();
    const ok = { startsAt: '2026-03-14T06:20:00Z', sampleRateHz: FS, components: { Ez: white(1, 3) } };
    const cases: [unknown, string, number][] = [
      ['{not json', 'body', 400],
      [{ ...ok, startsAt: '2026-03-14T06:25:00Z' }, 'startsAt', 400],
      [{ ...ok, startsAt: 'yesterday' }, 'startsAt', 400],
      // before the accepted sample dates (SAMPLE_EARLIEST, default 1990-01-01)
      [{ ...ok, startsAt: '1000-01-01T00:00:00Z' }, 'startsAt', 400],
      [{ ...ok, sampleRateHz: 200 }, 'sampleRateHz', 400],
      [{ ...ok, components: { Ez: white(1, 3).slice(0, 1000) } }, 'components.Ez', 400],
      [{ ...ok, components: { Bew: white(1, 3) } }, 'components.Bew', 400],
      [{ ...ok, components: {} }, 'components', 400],
    ];
    for (const [body, field, status] of cases) {
      const res = await push(w.secret, body);
      expect(res.status, `field ${field}`).toBe(status);
      const j = await res.json();
      expect(j.error.field).toBe(field);
      expect(typeof j.error.message).toBe('string');
      expect(j.error.code).toBeTruthy();
    }
    expect(await listIntervals({ networkId: w.networkId })).toHaveLength(0);
  });

  it('refuses missing and revoked tokens (401) and a full window (429 with Retry-After)', async () => {
    const w = await setup();
    const body = { startsAt: '2026-03-14T06:30:00Z', sampleRateHz: FS, components: { Ez: white(1, 4) } };
    const none = await push(null, body);
    expect(none.status).toBe(401);
    expect((await none.json()).error.code).toBe('token_missing');
    process.env.PUSH_RATE_PER_MINUTE = '1';
    expect((await push(w.secret, body)).status).toBe(201);
    const slow = await push(w.secret, body);
    expect(slow.status).toBe(429);
    expect(Number(slow.headers.get('retry-after'))).toBeGreaterThan(0);
    await revokePushToken(w.networkId, w.station.id, w.tokenId);
    const revoked = await push(w.secret, body);
    expect(revoked.status).toBe(401);
    expect((await revoked.json()).error).toMatchObject({ code: 'token_revoked', field: 'authorization' });
  });
});
