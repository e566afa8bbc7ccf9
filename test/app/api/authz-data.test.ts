/**
 * Authorization matrix for the data API (stations, push tokens, uploads,
 * intervals, exports): every route × every caller against the expected
 * status. Rules from the permission table (src/auth/permissions.ts): viewers
 * read and export, analysts also upload and flag, owners also manage stations,
 * tokens and deletions; members of another network get 404 (common practice:
 * other networks' ids are not confirmed).
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { closeDatabase, resetDatabase } from '@/test/helpers/db';
import { CALLERS, call, setupCallers, type AuthzWorld, type CallerName } from '@/test/helpers/authz';
import { stopBoss } from '@/db/jobs';
import { createStation } from '@/db/repo/stations';
import { storeUpload, failUpload } from '@/db/repo/uploads';
import { saveIntervals } from '@/db/repo/intervals';
import { issuePushToken } from '@/src/data/push-tokens';
import * as stationsRoute from '@/app/api/networks/[networkId]/stations/route';
import * as stationRoute from '@/app/api/networks/[networkId]/stations/[stationId]/route';
import * as tokensRoute from '@/app/api/networks/[networkId]/stations/[stationId]/tokens/route';
import * as tokenRoute from '@/app/api/networks/[networkId]/stations/[stationId]/tokens/[tokenId]/route';
import * as uploadsRoute from '@/app/api/networks/[networkId]/uploads/route';
import * as uploadRoute from '@/app/api/networks/[networkId]/uploads/[uploadId]/route';
import * as retryRoute from '@/app/api/networks/[networkId]/uploads/[uploadId]/retry/route';
import * as intervalsRoute from '@/app/api/networks/[networkId]/intervals/route';
import * as intervalRoute from '@/app/api/networks/[networkId]/intervals/[intervalId]/route';
import * as exportRoute from '@/app/api/networks/[networkId]/intervals/export/route';
import * as spectraRoute from '@/app/api/networks/[networkId]/intervals/spectra/route';
import { stationInput } from '@/test/data/world';
import { seriesCsv } from '@/test/data/series-maker';

let w: AuthzWorld;
let stationId = '';
let intervalId = '';
let seq = 0;
const code = () => `Z${(seq++).toString(36).toUpperCase().padStart(3, '0')}`;

beforeAll(async () => {
  await resetDatabase();
  w = await setupCallers('data');
  const st = await createStation(w.networkId, stationInput({ code: 'AUTH1', sampleRateHz: 100 }));
  stationId = st.id;
  [{ id: intervalId }] = await saveIntervals([
    {
      networkId: w.networkId,
      stationId,
      component: 'Ez',
      startsAt: new Date('2026-03-14T00:00:00Z'),
      durationS: 600,
      origin: 'synthetic',
      uploadId: null,
      rejectedShare: 0,
      qualityFlags: [],
      spectrum: { frequencies: [5, 6], power: [1e-9, 2e-9], segments: 119 },
      fit: null,
    },
  ]);
});
afterAll(async () => {
  await stopBoss(5000);
  await closeDatabase();
});

async function freshStation() {
  return (await createStation(w.networkId, stationInput({ code: code() }))).id;
}
async function freshUpload(failed = false) {
  const { upload } = await storeUpload(
    { networkId: w.networkId, stationId, uploadedBy: null, fileName: 'f.csv', format: 'series-csv' },
    async (wr) => {
      const b = Buffer.from(`x${seq++}`);
      await wr.append(b);
      return { sha256: `${'0'.repeat(56)}${(seq++).toString(16).padStart(8, '0')}`, sizeBytes: b.length };
    },
  );
  if (failed) await failUpload(upload.id, 'test failure');
  return upload.id;
}
async function freshToken() {
  return (await issuePushToken(w.networkId, stationId, w.callers.owner.userId!, { label: 't', expiresInDays: null })).token.id;
}

const P = () => ({ networkId: w.networkId });
const S = () => ({ networkId: w.networkId, stationId });

type Row = { name: string; expect: [number, number, number, number, number]; run: (c: CallerName) => Promise<Response> };
const READ: Row['expect'] = [401, 200, 200, 200, 404];
const OWNER: Row['expect'] = [401, 403, 403, 200, 404];

const rows: Row[] = [
  { name: 'GET stations', expect: READ, run: (c) => call(stationsRoute.GET, w.callers[c], { params: P() }) },
  {
    name: 'POST stations',
    expect: [401, 403, 403, 201, 404],
    run: (c) => call(stationsRoute.POST, w.callers[c], { method: 'POST', params: P(), body: stationInput({ code: code() }) }),
  },
  { name: 'GET station', expect: READ, run: (c) => call(stationRoute.GET, w.callers[c], { params: S() }) },
  {
    name: 'PUT station',
    expect: OWNER,
    run: (c) =>
      call(stationRoute.PUT, w.callers[c], {
        method: 'PUT',
        params: S(),
        body: stationInput({ code: 'AUTH1', sampleRateHz: 100 }),
      }),
  },
  {
    name: 'DELETE station',
    expect: OWNER,
    run: async (c) =>
      call(stationRoute.DELETE, w.callers[c], {
        method: 'DELETE',
        params: { networkId: w.networkId, stationId: await freshStation() },
      }),
  },
  { name: 'GET tokens', expect: OWNER, run: (c) => call(tokensRoute.GET, w.callers[c], { params: S() }) },
  {
    name: 'POST tokens',
    expect: [401, 403, 403, 201, 404],
    run: (c) => call(tokensRoute.POST, w.callers[c], { method: 'POST', params: S(), body: { label: 'pc' } }),
  },
  {
    name: 'DELETE token',
    expect: OWNER,
    run: async (c) =>
      call(tokenRoute.DELETE, w.callers[c], { method: 'DELETE', params: { ...S(), tokenId: await freshToken() } }),
  },
  {
    name: 'GET uploads',
    expect: READ,
    run: (c) => call(uploadsRoute.GET, w.callers[c], { params: P(), path: `/x?station=${stationId}` }),
  },
  {
    name: 'POST upload',
    expect: [401, 403, 201, 201, 404],
    run: (c) =>
      call(uploadsRoute.POST, w.callers[c], {
        method: 'POST',
        params: P(),
        path: `/x?station=${stationId}&name=rec.csv`,
        rawBody: seriesCsv({
          station: 'AUTH1',
          fs: 100,
          startUtc: '2026-03-14T00:00:00Z',
          seconds: 10,
          seed: seq++,
          components: { Ez: { kind: 'white', sigma: 1, unit: 'mV/m' } },
        }),
      }),
  },
  {
    name: 'GET upload',
    expect: READ,
    run: async (c) => call(uploadRoute.GET, w.callers[c], { params: { ...P(), uploadId: await freshUpload() } }),
  },
  {
    name: 'DELETE upload',
    expect: OWNER,
    run: async (c) =>
      call(uploadRoute.DELETE, w.callers[c], { method: 'DELETE', params: { ...P(), uploadId: await freshUpload() } }),
  },
  {
    name: 'POST retry',
    expect: [401, 403, 200, 200, 404],
    run: async (c) =>
      call(retryRoute.POST, w.callers[c], { method: 'POST', params: { ...P(), uploadId: await freshUpload(true) } }),
  },
  {
    name: 'GET intervals',
    expect: READ,
    run: (c) => call(intervalsRoute.GET, w.callers[c], { params: P(), path: `/x?station=${stationId}` }),
  },
  { name: 'GET interval', expect: READ, run: (c) => call(intervalRoute.GET, w.callers[c], { params: { ...P(), intervalId } }) },
  {
    name: 'PATCH interval flag',
    expect: [401, 403, 200, 200, 404],
    run: (c) =>
      call(intervalRoute.PATCH, w.callers[c], { method: 'PATCH', params: { ...P(), intervalId }, body: { flagged: false } }),
  },
  { name: 'GET export', expect: READ, run: (c) => call(exportRoute.GET, w.callers[c], { params: P(), path: '/x?format=csv' }) },
  {
    name: 'GET spectra',
    expect: READ,
    run: (c) => call(spectraRoute.GET, w.callers[c], { params: P(), path: `/x?station=${stationId}&day=2026-03-14` }),
  },
];

describe('data API authorization', () => {
  for (const row of rows) {
    it(row.name, async () => {
      const got: number[] = [];
      for (const c of CALLERS) {
        const res = await row.run(c);
        got.push(res.status);
        if (res.status >= 400) {
          const body = await res.json();
          expect(body.error.code, `${row.name} as ${c}`).toBeTruthy();
          expect(JSON.stringify(body)).not.toMatch(/at .*\.ts:\d+/); // never a stack trace
        }
      }
      expect(got).toEqual(row.expect);
    });
  }

  it("another network cannot reach this network's station through its own id", async () => {
    const res = await call(stationRoute.GET, w.callers.otherOwner, { params: { networkId: w.otherNetworkId, stationId } });
    expect(res.status).toBe(404);
  });
});
