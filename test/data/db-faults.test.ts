/**
 * The database restarting under an upload and a push: the API answers 503 with Retry-After
 * (RFC 9110 §15.6.4 Service Unavailable, §10.2.3 Retry-After), nothing is half-stored, nothing is
 * thrown uncaught (vitest fails a file on an unhandled error), and the same request sent again
 * once the database is back is stored whole, once. Runs its own PostgreSQL cluster so it can
 * stop and start it (pg_ctl fast shutdown ends every connection: SQLSTATE 57P01 admin_shutdown).
 */
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { freePort, startLocalPostgres, type LocalPg } from '@/db/pglocal';
import { migrate } from '@/db/migrate';
import { closeDatabase } from '@/db/lifecycle';
import { stopBoss } from '@/db/jobs';
import { listUploads, readUploadBytes } from '@/db/repo/uploads';
import { listIntervals } from '@/db/repo/intervals';
import { startSession } from '@/src/auth/session';
import { issuePushToken } from '@/src/data/push-tokens';
import { isDatabaseFault } from '@/src/server/db-faults';
import { AppError } from '@/src/server/errors';
import * as uploadsRoute from '@/app/api/networks/[networkId]/uploads/route';
import { POST as pushPost } from '@/app/api/v1/push/intervals/route';
import { makeWorld } from './world';
import { seriesCsv, synthesize } from './series-maker';

const FS = 100;
let root = '';
let port = 0;
let pg: LocalPg | null = null;
const previousUrl = process.env.DATABASE_URL;

const startPg = async () => {
  pg = await startLocalPostgres({ dataDir: path.join(root, 'pg'), port, ephemeral: true });
  return pg;
};

beforeAll(async () => {
  root = mkdtempSync(path.join(tmpdir(), 'cavitas-faults-'));
  port = await freePort();
  const first = await startPg();
  await migrate(first.url);
  process.env.DATABASE_URL = first.url;
});

afterAll(async () => {
  await stopBoss(5000).catch(() => {});
  await closeDatabase().catch(() => {});
  await pg?.stop().catch(() => {});
  rmSync(root, { recursive: true, force: true });
  if (previousUrl === undefined) delete process.env.DATABASE_URL;
  else process.env.DATABASE_URL = previousUrl;
});

describe('isDatabaseFault', () => {
  it('knows a lost or refused connection, also wrapped, and nothing else', () => {
    expect(isDatabaseFault({ code: '57P01' })).toBe(true);
    expect(isDatabaseFault({ code: '08006' })).toBe(true);
    expect(isDatabaseFault(Object.assign(new Error('connect'), { code: 'ECONNREFUSED' }))).toBe(true);
    expect(isDatabaseFault(new Error('query failed', { cause: { code: 'CONNECTION_CLOSED' } }))).toBe(true);
    expect(isDatabaseFault(new AggregateError([{ code: 'ECONNREFUSED' }, { code: 'ECONNREFUSED' }]))).toBe(true);
    expect(isDatabaseFault({ code: '23505' })).toBe(false);
    expect(isDatabaseFault(new AppError(400, 'bad_request', 'no'))).toBe(false);
    expect(isDatabaseFault(new TypeError('x'))).toBe(false);
  });
});

/** A body that stops the database once the first half of it has been read. */
function bodyStoppingDatabase(text: string): ReadableStream<Uint8Array> {
  const bytes = Buffer.from(text);
  const half = Math.floor(bytes.length / 2);
  let step = 0;
  return new ReadableStream<Uint8Array>({
    async pull(c) {
      if (step === 0) c.enqueue(bytes.subarray(0, half));
      if (step === 1) {
        await pg!.stop();
        c.enqueue(bytes.subarray(half));
      }
      if (step === 2) c.close();
      step++;
    },
  });
}

describe('a database restart', () => {
  it('during an upload: 503 with Retry-After, nothing stored, and the same upload stored once when sent again', async () => {
    const w = await makeWorld({ sampleRateHz: FS });
    const cookie = (await startSession(w.userId)).split(';')[0];
    const text = seriesCsv({
      station: 'TST1',
      fs: FS,
      startUtc: '2026-03-14T00:00:00Z',
      seconds: 600,
      components: { Ez: { kind: 'white', sigma: 1, unit: 'mV/m' }, Bns: { kind: 'white', sigma: 2, unit: 'counts' } },
    });
    const send = (body: ReadableStream<Uint8Array> | string) =>
      uploadsRoute.POST(
        new Request(`http://localhost/api/networks/${w.networkId}/uploads?station=${w.station.id}&name=day.csv`, {
          method: 'POST',
          headers: { cookie },
          body,
          duplex: 'half',
        } as RequestInit),
        { params: Promise.resolve({ networkId: w.networkId }) },
      );

    const refused = await send(bodyStoppingDatabase(text));
    expect(refused.status).toBe(503);
    expect(refused.headers.get('retry-after')).toMatch(/^\d+$/);
    expect((await refused.json()).error.code).toBe('unavailable');

    await startPg();
    expect(await listUploads(w.networkId)).toHaveLength(0);
    const stored = await send(text);
    expect(stored.status).toBe(201);
    const ups = await listUploads(w.networkId);
    expect(ups).toHaveLength(1);
    const parts: Buffer[] = [];
    for await (const c of readUploadBytes(ups[0].id)) parts.push(c);
    expect(Buffer.concat(parts).toString()).toBe(text);
  });

  it('during a push: 503 with Retry-After, and the same push stored once when sent again', async () => {
    const w = await makeWorld({ sampleRateHz: FS });
    const { secret } = await issuePushToken(w.networkId, w.station.id, w.userId, { label: 'hut pc', expiresInDays: 30 });
    const body = JSON.stringify({
      startsAt: '2026-03-14T06:20:00Z',
      sampleRateHz: FS,
      components: { Ez: Array.from(synthesize({ kind: 'white', sigma: 1, unit: 'raw' }, 600 * FS, FS, 3)) },
    });
    const send = (b: ReadableStream<Uint8Array> | string) =>
      pushPost(
        new Request('http://localhost/api/v1/push/intervals', {
          method: 'POST',
          headers: { authorization: `Bearer ${secret}`, 'content-type': 'application/json' },
          body: b,
          duplex: 'half',
        } as RequestInit),
      );
    const refused = await send(bodyStoppingDatabase(body));
    expect(refused.status).toBe(503);
    expect(refused.headers.get('retry-after')).toMatch(/^\d+$/);

    await startPg();
    expect(await listIntervals({ networkId: w.networkId })).toHaveLength(0);
    const stored = await send(body);
    expect(stored.status).toBe(201);
    expect(await listIntervals({ networkId: w.networkId })).toHaveLength(1);
  });
});
