/**
 * One interval's spectrum as a CSV file from the station page: viewers and up
 * may download it (other networks get 404, common practice), and the file is
 * in the project's own spectra layout, so its own reader gives back the
 * stored frequencies and power bit for bit, in SI units.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { closeQueueAndDatabase, resetDatabase } from '@/test/helpers/db';
import { CALLERS, call } from '@/test/helpers/authz';
import { getIntervalSpectra } from '@/db/repo/intervals';
import { readSpectraCsv } from '@/src/engine/formats/spectra-csv';
import * as spectrumRoute from '@/app/api/networks/[networkId]/intervals/[intervalId]/spectrum/route';
import { makeSharingWorld, type SharingWorld } from '@/test/sharing/world';

let w: SharingWorld;
beforeAll(async () => {
  await resetDatabase();
  w = await makeSharingWorld('spectrum');
});
afterAll(() => closeQueueAndDatabase());

describe('interval spectrum as CSV', () => {
  it('anonymous, viewer, analyst, owner, other network → 401, 200, 200, 200, 404', async () => {
    const [s] = await getIntervalSpectra({ networkId: w.networkId });
    const got: number[] = [];
    for (const c of CALLERS)
      got.push(
        (await call(spectrumRoute.GET, w.callers[c], { params: { networkId: w.networkId, intervalId: s.intervalId } })).status,
      );
    expect(got).toEqual([401, 200, 200, 200, 404]);
  });

  it('reads back, with the project’s own reader, as the stored spectrum', async () => {
    for (const s of await getIntervalSpectra({ networkId: w.networkId })) {
      const res = await call(spectrumRoute.GET, w.callers.viewer, {
        params: { networkId: w.networkId, intervalId: s.intervalId },
      });
      expect(res.headers.get('content-type')).toMatch(/text\/csv/);
      expect(res.headers.get('content-disposition')).toMatch(new RegExp(`${s.stationCode}-${s.component}`));
      const f = await readSpectraCsv([await res.text()], 'export.csv');
      expect(f).toMatchObject({ station: s.stationCode, component: s.component, intervalSeconds: 600 });
      expect(f.units).toBe(s.component === 'Ez' ? '(V/m)^2/Hz' : 'T^2/Hz');
      expect(Array.from(f.frequencies)).toEqual(s.frequencies);
      expect(f.intervals).toHaveLength(1);
      expect(f.intervals[0].startMs).toBe(s.startsAt.getTime());
      expect(Array.from(f.intervals[0].power)).toEqual(s.power);
    }
  });

  it('an interval that is not there is a 404', async () => {
    const res = await call(spectrumRoute.GET, w.callers.owner, {
      params: { networkId: w.networkId, intervalId: '7d1c6a7e-0000-4000-8000-000000000000' },
    });
    expect(res.status).toBe(404);
  });
});
