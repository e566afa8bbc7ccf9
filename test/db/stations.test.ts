/**
 * Station registry, uploads, intervals and push tokens against a throwaway PostgreSQL.
 */
import { createHash } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { closeDatabase, resetDatabase } from '@/test/helpers/db';
import * as stations from '@/db/repo/stations';
import * as uploads from '@/db/repo/uploads';
import * as intervals from '@/db/repo/intervals';
import * as tokens from '@/db/repo/push-tokens';
import { createStation as createStationService } from '@/src/data/stations';
import { makeWorld, stationInput } from '@/test/data/world';

beforeAll(resetDatabase);
afterAll(closeDatabase);

async function collect(it: AsyncIterable<Buffer>) {
  const parts: Buffer[] = [];
  for await (const p of it) parts.push(p);
  return Buffer.concat(parts);
}

describe('station registry', () => {
  it('stores a station with its components and lists it with counts', async () => {
    const { networkId, station } = await makeWorld();
    const got = await stations.getStation(networkId, station.id);
    expect(got?.components.map((c) => c.component)).toEqual(['Ez', 'Bns']);
    expect(got?.interferenceLines).toEqual([{ frequencyHz: 16.7, label: 'railway supply' }]);
    const list = await stations.listStations(networkId);
    expect(list).toHaveLength(1);
    expect(list[0].intervalCount).toBe(0);
    expect(list[0].firstIntervalAt).toBeNull();
  });

  it('refuses a second station with the same code in a network, naming the field', async () => {
    const { networkId } = await makeWorld();
    const body = { ...stationInput(), elevationM: null };
    await expect(createStationService(networkId, body, null)).rejects.toMatchObject({ status: 409, field: 'code' });
    // The same code in another network is fine.
    const other = await makeWorld();
    expect(other.station.code).toBe('TST1');
  });

  it('rejects out-of-range coordinates in the database too', async () => {
    const { networkId } = await makeWorld();
    await expect(stations.createStation(networkId, stationInput({ code: 'BAD', latitude: 91 }))).rejects.toThrow();
  });

  it('does not reveal a station through another network', async () => {
    const a = await makeWorld();
    const b = await makeWorld();
    expect(await stations.getStation(b.networkId, a.station.id)).toBeNull();
    expect(await stations.deleteStation(b.networkId, a.station.id)).toBe(false);
  });

  it('replaces components on update', async () => {
    const { networkId, station } = await makeWorld();
    const upd = await stations.updateStation(
      networkId,
      station.id,
      stationInput({
        name: 'Renamed',
        components: [
          {
            component: 'Bew',
            calibration: {
              kind: 'response',
              points: [
                { frequencyHz: 1, amplitude: 0.5, phaseDeg: 10 },
                { frequencyHz: 50, amplitude: 0.8, phaseDeg: -20 },
              ],
            },
          },
        ],
      }),
    );
    expect(upd?.name).toBe('Renamed');
    expect(upd?.components.map((c) => c.component)).toEqual(['Bew']);
  });
});

describe('uploads', () => {
  const meta = (networkId: string, stationId: string, userId: string) => ({
    networkId,
    stationId,
    uploadedBy: userId,
    fileName: 'a.csv',
    format: 'series-csv' as const,
  });

  it('stores bytes in chunks and reads them back identical, with the SHA-256', async () => {
    const { networkId, station, userId } = await makeWorld();
    // 2.5 chunks of pseudo-random bytes
    const data = Buffer.alloc(Math.floor(uploads.UPLOAD_CHUNK_BYTES * 2.5));
    for (let i = 0; i < data.length; i++) data[i] = (i * 2654435761) >>> 24;
    const sha = createHash('sha256').update(data).digest('hex');
    const { upload, duplicate } = await uploads.storeUpload(meta(networkId, station.id, userId), async (w) => {
      for (let o = 0; o < data.length; o += 100_000) await w.append(data.subarray(o, o + 100_000));
      return { sha256: sha, sizeBytes: data.length };
    });
    expect(duplicate).toBe(false);
    expect(upload.sha256).toBe(sha);
    expect((await collect(uploads.readUploadBytes(upload.id))).equals(data)).toBe(true);
  });

  it('recognises the same file again and stores nothing new', async () => {
    const { networkId, station, userId } = await makeWorld();
    // FIPS 180-2 appendix B.1: SHA-256("abc")
    const abc = 'ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad';
    expect(createHash('sha256').update('abc').digest('hex')).toBe(abc);
    const fill = async (w: uploads.UploadWriter) => {
      await w.append(Buffer.from('abc'));
      return { sha256: abc, sizeBytes: 3 };
    };
    const first = await uploads.storeUpload(meta(networkId, station.id, userId), fill);
    const second = await uploads.storeUpload({ ...meta(networkId, station.id, userId), fileName: 'copy.csv' }, fill);
    expect(second.duplicate).toBe(true);
    expect(second.upload.id).toBe(first.upload.id);
    expect(await uploads.listUploads(networkId)).toHaveLength(1);
  });

  it('stores nothing when the check of the file fails', async () => {
    const { networkId, station, userId } = await makeWorld();
    await expect(
      uploads.storeUpload(meta(networkId, station.id, userId), async (w) => {
        await w.append(Buffer.alloc(uploads.UPLOAD_CHUNK_BYTES + 10));
        throw new Error('line 7: not a number');
      }),
    ).rejects.toThrow('line 7');
    expect(await uploads.listUploads(networkId)).toHaveLength(0);
  });

  it('moves through processing states, fails with a reason and can be queued again', async () => {
    const { networkId, station, userId } = await makeWorld();
    const { upload } = await uploads.storeUpload(meta(networkId, station.id, userId), async (w) => {
      await w.append(Buffer.from('x'));
      return { sha256: 'f'.repeat(64), sizeBytes: 1 };
    });
    expect((await uploads.beginProcessing(upload.id))?.attempts).toBe(1);
    expect(await uploads.beginProcessing(upload.id)).toBeNull(); // already claimed
    await uploads.failUpload(upload.id, 'line 3: bad');
    expect((await uploads.getUpload(networkId, upload.id))?.error).toBe('line 3: bad');
    expect(await uploads.requeueFailed(networkId, upload.id)).not.toBeNull();
    expect(await uploads.requeueFailed(networkId, upload.id)).toBeNull(); // not failed any more
    expect((await uploads.beginProcessing(upload.id))?.attempts).toBe(2);
  });
});

describe('intervals', () => {
  const base = (networkId: string, stationId: string, minute: number) => ({
    networkId,
    stationId,
    component: 'Ez' as const,
    startsAt: new Date(Date.UTC(2026, 2, 1, 0, minute)),
    durationS: 600,
    origin: 'push' as const,
    uploadId: null,
    rejectedShare: 0.1,
    qualityFlags: [],
    spectrum: { frequencies: [5, 5.1, 5.2], power: [1e-8, 2e-8, 3e-8], segments: 119 },
    fit: {
      modes: [
        { frequency: 7.8, amplitude: 1e-8, halfWidth: 1, q: 3.9, errors: { frequency: 0.1, amplitude: 1e-9, halfWidth: 0.1 } },
      ],
      background: { b0: 0, b1: 0 },
      misfit: 1,
    },
  });

  it("saves the same interval twice as one row and keeps a person's flag", async () => {
    const { networkId, station, userId } = await makeWorld();
    const [a] = await intervals.saveIntervals([base(networkId, station.id, 0)]);
    expect(a.created).toBe(true);
    await intervals.setIntervalFlag(networkId, a.id, { reason: 'storm overhead', userId });
    const [b] = await intervals.saveIntervals([{ ...base(networkId, station.id, 0), rejectedShare: 0.2 }]);
    expect(b).toEqual({ id: a.id, created: false });
    const all = await intervals.listIntervals({ networkId, includeFlagged: true });
    expect(all).toHaveLength(1);
    expect(all[0].flagReason).toBe('storm overhead');
    expect(all[0].rejectedShare).toBeCloseTo(0.2, 6);
    expect(await intervals.listIntervals({ networkId })).toHaveLength(0); // flagged ones left out by default
  });

  it("keeps a fit's band, averages, bin correlation and excluded ranges, and loads fits stored without them", async () => {
    const { networkId, station } = await makeWorld();
    const older = base(networkId, station.id, 40);
    const recorded = base(networkId, station.id, 50);
    const settings = {
      band: { minHz: 3, maxHz: 36.3 },
      averages: 112.7,
      binCorrelation: [4 / 9, 1 / 36],
      excluded: [{ minHz: 16.4, maxHz: 16.9 }],
    };
    await intervals.saveIntervals([older, { ...recorded, fit: { ...recorded.fit, ...settings } }]);
    const [a, b] = await intervals.listIntervals({ networkId });
    expect(a.fit).toEqual(older.fit); // no band, averages or correlation keys at all
    expect(b.fit).toEqual({ ...recorded.fit, ...settings });
    // saving again without them (e.g. reprocessed by other code) leaves none behind
    await intervals.saveIntervals([{ ...recorded }]);
    expect((await intervals.listIntervals({ networkId }))[1].fit).toEqual(recorded.fit);
    // "nothing left out" ([]) is kept apart from "not recorded" (absent)
    await intervals.saveIntervals([{ ...recorded, fit: { ...recorded.fit, excluded: [] } }]);
    expect((await intervals.listIntervals({ networkId }))[1].fit!.excluded).toEqual([]);
  });

  it('filters by time, component and clean flags and returns spectra arrays', async () => {
    const { networkId, station } = await makeWorld();
    await intervals.saveIntervals([0, 10, 20].map((m) => base(networkId, station.id, m)));
    await intervals.saveIntervals([{ ...base(networkId, station.id, 30), qualityFlags: ['fit-failed'], fit: null }]);
    const from = new Date(Date.UTC(2026, 2, 1, 0, 10));
    const to = new Date(Date.UTC(2026, 2, 1, 0, 30));
    expect((await intervals.listIntervals({ networkId, from, to })).map((r) => r.startsAt.getUTCMinutes())).toEqual([10, 20]);
    expect(await intervals.listIntervals({ networkId, components: ['Bns'] })).toHaveLength(0);
    expect(await intervals.listIntervals({ networkId, requireClean: true })).toHaveLength(3);
    const spectra = await intervals.getIntervalSpectra({ networkId, from, to });
    expect(spectra[0].power).toEqual([1e-8, 2e-8, 3e-8]);
    expect(spectra[0].segments).toBe(119);
    expect(spectra[0].stationCode).toBe('TST1');
    const list = await stations.listStations(networkId);
    expect(list[0].intervalCount).toBe(4);
    // the stored span, first and last interval start (the run set-up offers it)
    expect(list[0].firstIntervalAt?.toISOString()).toBe('2026-03-01T00:00:00.000Z');
    expect(list[0].lastIntervalAt?.toISOString()).toBe('2026-03-01T00:30:00.000Z');
  });
});

describe('push token rate window', () => {
  it('counts requests within a window and starts again after it', async () => {
    const { networkId, station, userId } = await makeWorld();
    const t = await tokens.createPushToken({
      networkId,
      stationId: station.id,
      label: 'hut pc',
      secretHash: 'h'.repeat(64),
      hint: 'cvs_abcd…',
      createdBy: userId,
      expiresAt: null,
    });
    expect((await tokens.countPushRequest(t.id, 60)).count).toBe(1);
    expect((await tokens.countPushRequest(t.id, 60)).count).toBe(2);
    const third = await tokens.countPushRequest(t.id, 60);
    expect(third.count).toBe(3);
    expect(third.resetInS).toBeGreaterThan(50);
    expect(third.resetInS).toBeLessThanOrEqual(60);
    // A window of zero seconds has always ended: the count starts again.
    expect((await tokens.countPushRequest(t.id, 0)).count).toBe(1);
    const found = await tokens.findPushTokenByHash('h'.repeat(64));
    expect(found?.stationCode).toBe('TST1');
    expect(found).not.toHaveProperty('secretHash');
  });
});

describe('uploads sent twice at the same moment', () => {
  it('keep one copy and report the other as a duplicate', async () => {
    const { networkId, station, userId } = await makeWorld();
    const sha = 'e'.repeat(64);
    const send = () =>
      uploads.storeUpload(
        { networkId, stationId: station.id, uploadedBy: userId, fileName: 'x.csv', format: 'series-csv' },
        async (w) => {
          await w.append(Buffer.from('same'));
          await new Promise((r) => setTimeout(r, 200));
          return { sha256: sha, sizeBytes: 4 };
        },
      );
    const [a, b] = await Promise.all([send(), send()]);
    expect([a.duplicate, b.duplicate].sort()).toEqual([false, true]);
    expect(a.upload.id).toBe(b.upload.id);
    expect(await uploads.listUploads(networkId)).toHaveLength(1);
  });
});
